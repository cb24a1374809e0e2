// Reading the file name back from the Content-Disposition header the server sends. The header is made here
// with the function Express's res.attachment() calls (content-disposition's create), so the client reads what
// the server really writes: tokens, quoted names and RFC 6266 filename* alike.
import { create } from 'content-disposition';
import { describe, expect, it } from 'vitest';
import { dispositionFilename } from '@/api/download.ts';

describe('dispositionFilename', () => {
  it.each([
    'A_10-results.csv',
    'REF-1-P01-calculations.pdf',
    'level loads.csv',
    'say "hello".txt',
    'Stütze C-4.pdf',
    'plan 3½.csv',
  ])('reads back %s from the header res.attachment() writes', (name) => {
    expect(dispositionFilename(create(name))).toBe(name);
  });

  it('is null when the header names no file', () => {
    expect(dispositionFilename('')).toBeNull();
    expect(dispositionFilename('inline')).toBeNull();
  });
});
