// Worker-thread entry of server/offThread/passwords.ts: bcrypt and the strength estimator, whose CPU time
// (a tenth of a second per hash at cost 10) would otherwise be spent on the event loop. Plain JavaScript
// on plain packages: no TypeScript loader, so the thread starts in a few milliseconds.
import bcrypt from 'bcryptjs';
import { ZxcvbnFactory } from '@zxcvbn-ts/core';
import * as common from '@zxcvbn-ts/language-common';
import * as en from '@zxcvbn-ts/language-en';
import { lowerPriority } from './lowerPriority.mjs';

lowerPriority(10);

let estimator = null;

export const hash = ({ password, rounds }) => bcrypt.hashSync(password, rounds);
export const compare = ({ password, hash: stored }) => bcrypt.compareSync(password, stored);

/** The estimator's score (0–4) with its feedback; built on first use (about 0.1 s to index the dictionaries). */
export async function rate({ password, personal }) {
  estimator ??= new ZxcvbnFactory({
    dictionary: { ...common.dictionary, ...en.dictionary },
    graphs: common.adjacencyGraphs,
    translations: en.translations,
  });
  const r = await estimator.check(password, personal);
  return { score: r.score, warning: r.feedback.warning ?? null, suggestions: r.feedback.suggestions };
}
