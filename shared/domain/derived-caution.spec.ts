import { DERIVED_CAUTION } from './derived-caution';

describe('DERIVED_CAUTION', () => {
  it.each<string>(['research', 'teaching', 'aviation', 'navigation', 'official observations'])('when shown, then it mentions %s', (word) => {
    const text = DERIVED_CAUTION;

    expect(text).toContain(word);
  });
});
