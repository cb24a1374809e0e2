// How guessable a password is, by the zxcvbn-ts estimator (offThread/passwordWorker.mjs) (common passwords, names, words, keyboard
// patterns, repeats, dates). Scores run 0 to 4; 3 is the estimator's own "safely unguessable" level
// (zxcvbn documentation: protection from an offline slow-hash attack), which bcrypt storage matches.
import { MAX_PASSWORD_BYTES, type PasswordStrength } from '../../shared/schema/api.ts';
import { unprocessable } from '../errors.ts';
import { rateOffThread } from '../offThread/passwords.ts';

export const REQUIRED_SCORE = 3;

/** Rates the password; the person's own address and name count as easy guesses. */
export async function rate(password: string, personal: string[] = []): Promise<PasswordStrength> {
  // The estimator's cost grows with length; past bcrypt's 72 bytes a password is refused anyway.
  const sample = password.slice(0, MAX_PASSWORD_BYTES);
  const whole = personal.flatMap((p) => [p.toLowerCase(), p.toLowerCase().split('@')[0] ?? '']);
  const words = [...whole, ...personal.flatMap((p) => p.toLowerCase().split(/[^a-z0-9]+/))].filter(
    (w) => w.length >= 3,
  );
  // On the worker thread of the password hashes: a check costs up to a few tens of milliseconds.
  const r = await rateOffThread(sample, words);
  return {
    score: r.score,
    required: REQUIRED_SCORE,
    acceptable: r.score >= REQUIRED_SCORE,
    warning: r.warning,
    suggestions: r.suggestions,
  };
}

/** 422 naming the field when the password is too easy to guess. */
export async function assertStrongPassword(password: string, personal: string[], field = 'password'): Promise<void> {
  const r = await rate(password, personal);
  if (r.acceptable) return;
  const why = r.warning ? ` (${r.warning.replace(/\.$/, '')})` : '';
  throw unprocessable(`This password is too easy to guess${why}; try a longer phrase of unrelated words`, {
    field,
    score: r.score,
    required: r.required,
    suggestions: r.suggestions,
  });
}
