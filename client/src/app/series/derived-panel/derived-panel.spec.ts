import { TestBed } from '@angular/core/testing';
import { DERIVED_CAUTION } from '@shared/domain/derived-caution';

import type { SeaLevelAssumptions } from '../plot-math/sea-level-line';
import { DerivedPanel } from './derived-panel';

jest.setTimeout(30_000);

describe('DerivedPanel', () => {
  async function render() {
    const fixture = TestBed.createComponent(DerivedPanel);
    fixture.componentRef.setInput('heightM', 413.2);
    const emitted: (SeaLevelAssumptions | null)[] = [];
    fixture.componentInstance.seaLevelChanged.subscribe((value) => emitted.push(value));
    await fixture.whenStable();
    return { fixture, emitted, element: fixture.nativeElement as HTMLElement };
  }

  it('when no temperature is typed, then the reduction is not applied and the field asks for one; the caution shows', async () => {
    const { fixture, emitted, element } = await render();

    element.querySelector<HTMLButtonElement>('[data-testid="msl-apply"]')!.click();
    await fixture.whenStable();

    expect(emitted).toEqual([]);
    expect(element.textContent).toContain('The archive holds no temperature');
    expect(element.querySelector('[data-testid="msl-caution"]')?.textContent).toContain(DERIVED_CAUTION);
  });

  it('when a temperature is typed, then the reduction is applied with the station height and the assumed values', async () => {
    const { fixture, emitted, element } = await render();
    const input = element.querySelector<HTMLInputElement>('[data-testid="msl-temperature"]')!;

    input.value = '8';
    input.dispatchEvent(new Event('input'));
    element.querySelector<HTMLButtonElement>('[data-testid="msl-apply"]')!.click();
    fixture.componentRef.setInput('seaLevel', emitted[0]);
    await fixture.whenStable();

    expect(emitted).toEqual([{ heightM: 413.2, temperatureC: 8, vapourPressureHpa: 0 }]);
    expect(element.querySelector('[data-testid="msl-assumed"]')?.textContent).toContain('assuming a station temperature of 8 °C');
  });

  it('when a tendency is given, then it reads with its sign, characteristic words and group', async () => {
    const { fixture, element } = await render();

    fixture.componentRef.setInput('tendency', { observationTimeMs: 0, amountHpa: -1.6, ppp: 16, characteristic: 6, group: '56016' });
    await fixture.whenStable();

    // docs/references.md §5 [D]: a net fall of 1.6 hPa with a slower second half is a = 6, group 56016.
    expect(element.querySelector('[data-testid="tendency"]')?.textContent).toBe(
      '−1.6 hPa in 3 h; characteristic a = 6 (falling, then steady or falling more slowly; now lower); group 56016.',
    );
  });
});
