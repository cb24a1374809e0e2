import { gradeSchema } from '../schema/stack.ts';
import type { Annex } from '../schema/results.ts';
import type { Grade } from '../schema/stack.ts';
import { EngineError } from './errors.ts';

const GRADES: ReadonlySet<string> = new Set(gradeSchema.options);

export function checkLength(name: string, value: number): void {
  if (typeof value !== 'number' || !Number.isFinite(value) || value <= 0) {
    throw new EngineError('invalid_input', `${name} must be a finite length above zero (mm), got ${String(value)}.`);
  }
}

export function checkAxialForce(NEd: number): void {
  if (typeof NEd !== 'number' || !Number.isFinite(NEd))
    throw new EngineError('invalid_input', `NEd must be a finite force (N), got ${String(NEd)}.`);
  if (NEd < 0)
    throw new EngineError('invalid_input', `NEd = ${NEd} N is tension; only compression (NEd ≥ 0) is checked here.`);
}

/** Partial factors: every National Annex uses values from 1.0 upwards; anything outside 1.0–2.0 is a slip. */
export function checkPartialFactor(name: string, value: number): void {
  if (typeof value !== 'number' || !Number.isFinite(value) || value < 1 || value > 2) {
    throw new EngineError('invalid_input', `${name} must be between 1.0 and 2.0, got ${String(value)}.`);
  }
}

export function checkGrade(grade: Grade): void {
  if (!GRADES.has(grade))
    throw new EngineError(
      'invalid_input',
      `Unknown steel grade "${String(grade)}": expected one of ${[...GRADES].join(', ')}.`,
    );
}

export function checkAnnex(annex: Annex): void {
  if (annex !== 'UK' && annex !== 'EN')
    throw new EngineError('invalid_input', `Unknown annex "${String(annex)}": expected "UK" or "EN".`);
}
