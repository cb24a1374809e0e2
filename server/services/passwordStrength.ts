// How guessable a password is, by the zxcvbn-ts estimator (common passwords, names, words, keyboard
// patterns, repeats, dates). Scores run 0 to 4; 3 is the estimator's own "safely unguessable" level
// (zxcvbn documentation: protection from an offline slow-hash attack), which bcrypt storage matches.
import { ZxcvbnFactory } from '@zxcvbn-ts/core';
import * as common from '@zxcvbn-ts/language-common';
import * as en from '@zxcvbn-ts/language-en';
import { MAX_PASSWORD_BYTES, type PasswordStrength } from '../../shared/schema/api.ts';
import { unprocessable } from '../errors.ts';

export const REQUIRED_SCORE = 3;

// Built once when the server starts (about 0.1 s to index the dictionaries), not on a request.
const estimator = new ZxcvbnFactory({
  dictionary: { ...common.dictionary, ...en.dictionary },
  graphs: common.adjacencyGraphs,
  translations: en.translations,
});

/** Rates the password; the person's own address and name count as easy guesses. */
export async function rate(password: string, personal: string[] = []): Promise<PasswordStrength> {
  // The estimator's cost grows with length; past bcrypt's 72 bytes a password is refused anyway.
  const sample = password.slice(0, MAX_PASSWORD_BYTES);
  const whole = personal.flatMap((p) => [p.toLowerCase(), p.toLowerCase().split('@')[0] ?? '']);
  const words = [...whole, ...personal.flatMap((p) => p.toLowerCase().split(/[^a-z0-9]+/))].filter((w) => w.length >= 3);
  const r = await estimator.check(sample, words);
  return {
    score: r.score,
    required: REQUIRED_SCORE,
    acceptable: r.score >= REQUIRED_SCORE,
    warning: r.feedback.warning ?? null,
    suggestions: r.feedback.suggestions,
  };
}

/** 422 naming the field when the password is too easy to guess. */
export async function assertStrongPassword(password: string, personal: string[], field = 'password'): Promise<void> {
  const r = await rate(password, personal);
  if (r.acceptable) return;
  const why = r.warning ? ` (${r.warning.replace(/\.$/, '')})` : '';
  throw unprocessable(`This password is too easy to guess${why}; try a longer phrase of unrelated words`, { field, score: r.score, required: r.required, suggestions: r.suggestions });
}
