import { readFileSync } from 'node:fs';
import path from 'node:path';
import { PASSWORD_MAX_LENGTH, PASSWORD_MIN_LENGTH } from '@shared/api/auth';
import { validationFailed } from '../errors/app-error';

let commonPasswords: Set<string> | undefined;

/** The shipped list (common-passwords.txt names its source), read once. */
function isCommon(candidate: string): boolean {
  commonPasswords ??= new Set(
    readFileSync(path.join(__dirname, 'common-passwords.txt'), 'utf8')
      .split('\n')
      .filter((line) => line !== '' && !line.startsWith('#')),
  );
  return commonPasswords.has(candidate);
}

/**
 * Why a new password is refused, or null when it is taken. Follows NIST SP 800-63B, 5.1.1.2: a length
 * floor (12 here), no composition rules, and refusal of passwords from a list of common ones, of repeated
 * or sequential characters and of words of the context (the service's name, the person's address or name).
 */
export function passwordProblem(password: string, context: { email: string; displayName?: string }): string | null {
  if (password.length < PASSWORD_MIN_LENGTH) return `must be at least ${PASSWORD_MIN_LENGTH} characters`;
  if (password.length > PASSWORD_MAX_LENGTH) return `must be at most ${PASSWORD_MAX_LENGTH} characters`;
  const lower = password.toLowerCase();
  // A common password with digits or marks tacked on (password1234!) is as easy to guess as the word.
  const stem = lower.replace(/[\d\W_]+$/, '');
  if (isCommon(lower) || (stem.length >= 4 && isCommon(stem))) return 'is one of the most common passwords; choose another';
  // One unit said twice or more (aaaaaaaaaaaa, abcabcabcabc, trustno1trustno1) adds nothing to the guessing.
  if (/^(.+?)\1+$/.test(lower)) return 'repeats the same characters; choose another';
  if (isSequence(lower)) return 'is a run of sequential characters; choose another';
  const words = ['isallo', context.email.toLowerCase().split('@')[0] ?? '', ...(context.displayName ?? '').toLowerCase().split(/\s+/)];
  if (words.some((word) => word.length >= 4 && lower.replace(/[\d\W_]+/g, '') === word.replace(/[\d\W_]+/g, ''))) {
    return 'is made of your name, address or the name of the service; choose another';
  }
  return null;
}

/** 123456789012…, abcdefghijkl…, or the same backwards. */
function isSequence(text: string): boolean {
  let up = true;
  let down = true;
  for (let i = 1; i < text.length; i += 1) {
    const step = text.charCodeAt(i) - text.charCodeAt(i - 1);
    if (step !== 1 && !(text[i] === '0' && text[i - 1] === '9')) up = false;
    if (step !== -1) down = false;
  }
  return up || down;
}

/** 400 validation_failed naming the field when the password is refused. */
export function assertPasswordTaken(field: string, password: string, context: { email: string; displayName?: string }): void {
  const problem = passwordProblem(password, context);
  if (problem) throw validationFailed({ [field]: `${field} ${problem}` }, 'The new password is not taken.');
}
