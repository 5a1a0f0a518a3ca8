import { spawn, type SpawnOptions } from 'node:child_process';

/** Runs a command with inherited output; resolves with its exit code (never rejects on a non-zero exit). */
export function runCommand(command: string, args: string[], options: SpawnOptions = {}): Promise<number> {
  return new Promise((resolve, reject) => {
    const child = spawn(command, args, { stdio: 'inherit', ...options });
    child.on('error', reject);
    child.on('exit', (code, signal) => resolve(code ?? (signal ? 128 : 1)));
  });
}

/** Runs a command and fails with its output when it exits non-zero. */
export async function runChecked(command: string, args: string[], options: SpawnOptions = {}): Promise<void> {
  const output: Buffer[] = [];
  const code = await new Promise<number>((resolve, reject) => {
    const child = spawn(command, args, { stdio: ['ignore', 'pipe', 'pipe'], ...options });
    child.stdout?.on('data', (chunk: Buffer) => output.push(chunk));
    child.stderr?.on('data', (chunk: Buffer) => output.push(chunk));
    child.on('error', reject);
    child.on('exit', (c) => resolve(c ?? 1));
  });
  if (code !== 0) {
    throw new Error(`${command} ${args.join(' ')} failed (exit ${code}):\n${Buffer.concat(output).toString()}`);
  }
}
