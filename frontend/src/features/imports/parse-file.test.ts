import { describe, expect, it } from 'vitest';
import { checkSize, FileProblem, guessDelimiter, parseCsvText, readCsvFile, UPLOAD_LIMIT_BYTES } from './parse-file';

describe('parseCsvText', () => {
  it('drops a byte-order mark and blank lines and trims cells', () => {
    const parsed = parseCsvText('\uFEFFpoll_key, share \r\n p1 ,40\r\n\r\np2,35\r\n');
    expect(parsed.headers).toEqual(['poll_key', 'share']);
    expect(parsed.rows).toEqual([
      ['p1', '40'],
      ['p2', '35'],
    ]);
    expect(parsed.delimiter).toBe(',');
  });

  it('reads semicolon files, keeping decimal commas in the cells', () => {
    const parsed = parseCsvText('poll_key;share\np1;40,5\n');
    expect(parsed.delimiter).toBe(';');
    expect(parsed.rows[0]).toEqual(['p1', '40,5']);
  });

  it('refuses a file without a header and one with a broken quote', () => {
    expect(() => parseCsvText('\n\n')).toThrow(FileProblem);
    expect(() => parseCsvText('a,b\n"x,1\n')).toThrow(/could not be read/);
  });

  it('decides the delimiter on the header line only', () => {
    expect(guessDelimiter('a;b;c\n1,2,3,4,5\n')).toBe(';');
    expect(guessDelimiter('a,b\n1;2;3;4\n')).toBe(',');
  });
});

describe('file checks', () => {
  it('refuses a file over the upload limit with the limit in the message', () => {
    expect(() => checkSize(UPLOAD_LIMIT_BYTES + 1)).toThrow(/upload limit is 50 MB/);
    expect(() => checkSize(UPLOAD_LIMIT_BYTES)).not.toThrow();
  });

  it('refuses bytes that are not UTF-8', async () => {
    // 0xE9 alone is "é" in Latin-1 and an invalid sequence in UTF-8. [practice] RFC 3629
    const file = new File([new Uint8Array([0x61, 0x2c, 0x62, 0x0a, 0xe9, 0x2c, 0x31, 0x0a])], 'latin1.csv', { type: 'text/csv' });
    await expect(readCsvFile(file)).rejects.toThrow(/not UTF-8/);
  });
});
