// Uploads cannot stall the server or flood the reply (docs/access.md): a line longer than any real row and
// a file of more rows than the limit are refused before parsing, and at most 100 problems are listed with
// a count of the rest.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  MAX_IMPORT_LINE_CHARS,
  MAX_IMPORT_ROWS,
  MAX_LISTED_PROBLEMS,
  type LoadsPreview,
} from '../../shared/schema/imports.ts';
import { upload } from '../fixtures/uploads.ts';
import { errorCode, startWithLeadAndBuilding, type TestServer } from './helpers.ts';

describe('import limits', () => {
  let s: TestServer;
  let token: string;
  let buildingId: number;
  beforeAll(async () => {
    ({ s, token, buildingId } = await startWithLeadAndBuilding('Import limits block'));
  });
  afterAll(async () => {
    await s?.close();
  });
  const preview = (body: string) => upload(s, `/buildings/${buildingId}/imports/loads`, token, body);
  const header = 'stack,level,Gk_kN,Qk_kN,category\n';

  it('answers a file of a million commas at once with one short problem', async () => {
    const started = performance.now();
    const r = await preview(','.repeat(1_000_000));
    expect(r.status).toBe(422);
    expect(errorCode(r.body)).toBe('unprocessable');
    const details = (r.body as { error: { details: LoadsPreview } }).error.details;
    expect(details.problems).toHaveLength(1);
    expect(details.problems[0]!.message).toContain(`longer than ${MAX_IMPORT_LINE_CHARS} characters`);
    expect(JSON.stringify(r.body).length).toBeLessThan(2000);
    // Generous: the point is no longer seconds (it took 12.7 s and answered 104 MB before).
    expect(performance.now() - started).toBeLessThan(5000);
  });

  it('refuses more rows than the limit before reading them', async () => {
    const r = await preview(header + 'A/1,L1,1,1,B\n'.repeat(MAX_IMPORT_ROWS + 5));
    expect(r.status).toBe(422);
    const details = (r.body as { error: { details: LoadsPreview } }).error.details;
    expect(details.problems.map((p) => p.message)).toEqual([
      `The file has more than ${MAX_IMPORT_ROWS} rows; at most ${MAX_IMPORT_ROWS} can be imported at once`,
    ]);
  });

  it('lists the first 100 problems and says how many more were left out', async () => {
    // 300 rows naming a stack that does not exist, each with a negative load: two problems or more a row.
    const rows = Array.from({ length: 300 }, (_, i) => `Nowhere/${i},No level,-1,-1,B`).join('\n');
    const r = await preview(header + rows);
    expect(r.status).toBe(422);
    const body = r.body as { error: { message: string; details: LoadsPreview } };
    const { problems, problemsOmitted } = body.error.details;
    expect(problems).toHaveLength(MAX_LISTED_PROBLEMS + 1);
    expect(problemsOmitted).toBeGreaterThanOrEqual(300 * 2 - MAX_LISTED_PROBLEMS);
    expect(problems.at(-1)!.message).toBe(
      `… and ${problemsOmitted} more problems not listed; fix these and upload the file again`,
    );
    expect(body.error.message).toBe(
      `The file has ${MAX_LISTED_PROBLEMS + problemsOmitted!} problems; nothing was changed`,
    );
  });
});
