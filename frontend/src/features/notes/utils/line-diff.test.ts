import { describe, expect, it } from 'vitest';
import { diffLines, diffStats } from './line-diff';

describe('diffLines', () => {
  it('pairs unchanged lines and shows a changed line beside its new form', () => {
    const rows = diffLines('a\nb\nc\nd', 'a\nB\nc\nd\ne');
    expect(rows.map((r) => [r.op, r.left, r.right])).toEqual([
      ['same', 'a', 'a'],
      ['removed', 'b', 'B'],
      ['same', 'c', 'c'],
      ['same', 'd', 'd'],
      ['added', null, 'e'],
    ]);
    expect(diffStats(rows)).toEqual({ removed: 1, added: 2 });
  });

  it('numbers lines on each side independently', () => {
    const rows = diffLines('x\ny', 'w\nx\ny');
    expect(rows.map((r) => [r.leftNumber, r.rightNumber])).toEqual([[null, 1], [1, 2], [2, 3]]);
  });

  it('finds the longest common run in the middle', () => {
    const rows = diffLines('h\n1\n2\n3\nt', 'h\n2\n3\n4\nt');
    expect(rows.filter((r) => r.op === 'same').map((r) => r.left)).toEqual(['h', '2', '3', 't']);
    expect(diffStats(rows)).toEqual({ removed: 1, added: 1 });
  });

  it('identical texts have no change, and every line survives on its side', () => {
    expect(diffStats(diffLines('p\nq', 'p\nq'))).toEqual({ removed: 0, added: 0 });
    const before = 'one\ntwo\nthree\nfour';
    const after = 'zero\ntwo\nfour\nfive';
    const rows = diffLines(before, after);
    expect(rows.flatMap((r) => (r.left === null ? [] : [r.left]))).toEqual(before.split('\n'));
    expect(rows.flatMap((r) => (r.right === null ? [] : [r.right]))).toEqual(after.split('\n'));
  });
});
