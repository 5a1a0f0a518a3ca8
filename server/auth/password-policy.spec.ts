import { passwordProblem } from './password-policy';

const context = { email: 'ada.byron@archive.example', displayName: 'Ada Byron' };

describe('passwordProblem', () => {
  it.each(['correct-pen-arm-42', 'drum turns once a week', 'Barogram 1931 Kew'])('when the password is %p, then it is taken', (password) => {
    const problem = passwordProblem(password, context);

    expect(problem).toBeNull();
  });

  it('when the password has 11 characters, then it is refused for its length', () => {
    const problem = passwordProblem('abcdefgh-1x', context);

    expect(problem).toBe('must be at least 12 characters');
  });

  // The shipped list is the zxcvbn-ts common-password list (see common-passwords.txt): these are in it.
  it.each(['1qaz2wsx3edc', 'QWERTY123456', 'password1234!', 'trustno1trustno1'])('when the password is the common %p, then it is refused', (password) => {
    const problem = passwordProblem(password, context);

    expect(problem).not.toBeNull();
  });

  it.each(['aaaaaaaaaaaa', 'abcabcabcabc', '123456789012', 'zyxwvutsrqpo'])('when the password is the repetitive or sequential %p, then it is refused', (password) => {
    const problem = passwordProblem(password, context);

    expect(problem).not.toBeNull();
  });

  it.each(['ada.byron123', 'Isallo-2026!!'])('when the password is made of context words (%p), then it is refused', (password) => {
    const problem = passwordProblem(password, context);

    expect(problem).toMatch(/name, address or the name of the service/);
  });
});
