import { describe, expect, it } from 'vitest';
import { safeFilename } from './download';

describe('safeFilename', () => {
  it('keeps letters, digits, dot, dash and underscore', () => {
    expect(safeFilename('audit 3/almerand-2022 general')).toBe('audit-3-almerand-2022-general');
    expect(safeFilename('///')).toBe('export');
  });
});
