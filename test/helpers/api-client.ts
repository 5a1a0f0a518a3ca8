import { DEMO_PASSWORD } from '../../server/demo/demo-scenario';

/** A bearer token for a demo account, through the sign-in route (for reads and settings a browser test makes beside the UI). */
export async function tokenFor(baseUrl: string, email: string): Promise<string> {
  const response = await fetch(`${baseUrl}/api/auth/sign-in`, { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify({ email, password: DEMO_PASSWORD }) });
  if (!response.ok) throw new Error(`sign-in for ${email} answered ${response.status}: ${await response.text()}`);
  return ((await response.json()) as { token: string }).token;
}

/** One JSON call to the API with a bearer token; a non-2xx answer throws with its body. */
export async function apiCall<T>(baseUrl: string, token: string, path: string, init: RequestInit = {}): Promise<T> {
  const response = await fetch(`${baseUrl}${path}`, { ...init, headers: { Authorization: `Bearer ${token}`, 'Content-Type': 'application/json' } });
  if (!response.ok) throw new Error(`${path} answered ${response.status}: ${await response.text()}`);
  return (await response.json()) as T;
}

/** Puts one scan first in the volunteers' queue (the demo's own ready chart is older and would come first). */
export async function putScanFirstInQueue(baseUrl: string, stationName: string): Promise<string> {
  const archivistToken = await tokenFor(baseUrl, 'archivist@isallo.test');
  const stations = await apiCall<{ items: { id: string; name: string }[] }>(baseUrl, archivistToken, '/api/stations?pageSize=200');
  const stationId = stations.items.find((station) => station.name === stationName)?.id;
  if (!stationId) throw new Error(`no station named ${stationName}`);
  const found = await apiCall<{ items: { id: string }[] }>(baseUrl, archivistToken, `/api/scans?stationId=${stationId}`);
  if (found.items.length !== 1) throw new Error(`expected one scan at ${stationName}, found ${found.items.length}`);
  const scanId = found.items[0].id;
  await apiCall(baseUrl, archivistToken, '/api/tracing/priorities', { method: 'PUT', body: JSON.stringify({ scope: 'scan', scanId, priority: 10 }) });
  return scanId;
}
