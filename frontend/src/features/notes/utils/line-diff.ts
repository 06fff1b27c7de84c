export type DiffOp = 'same' | 'removed' | 'added';

/** One row of a side-by-side comparison: the left line, the right line, or both when unchanged. */
export interface DiffRow {
  op: DiffOp;
  left: string | null;
  right: string | null;
  leftNumber: number | null;
  rightNumber: number | null;
}

/** Above this many cells the table of the longest common subsequence is not built. */
const MAX_CELLS = 4_000_000;

/**
 * A line diff by longest common subsequence (dynamic programming over the lines that differ,
 * after the common head and tail are set aside). Unchanged lines pair up side by side; a run of
 * removals followed by additions is paired row by row so a changed line sits beside its new form.
 */
export function diffLines(before: string, after: string): DiffRow[] {
  const a = before.split(/\r?\n/);
  const b = after.split(/\r?\n/);
  let head = 0;
  while (head < a.length && head < b.length && a[head] === b[head]) head++;
  let tail = 0;
  while (tail < a.length - head && tail < b.length - head && a[a.length - 1 - tail] === b[b.length - 1 - tail]) tail++;
  const midA = a.slice(head, a.length - tail);
  const midB = b.slice(head, b.length - tail);

  const ops: { op: DiffOp; line: string }[] = [];
  if ((midA.length + 1) * (midB.length + 1) > MAX_CELLS) {
    for (const line of midA) ops.push({ op: 'removed', line });
    for (const line of midB) ops.push({ op: 'added', line });
  } else {
    const n = midA.length;
    const m = midB.length;
    const lcs = Array.from({ length: n + 1 }, () => new Uint32Array(m + 1));
    for (let i = n - 1; i >= 0; i--) {
      for (let j = m - 1; j >= 0; j--) {
        lcs[i]![j] = midA[i] === midB[j] ? lcs[i + 1]![j + 1]! + 1 : Math.max(lcs[i + 1]![j]!, lcs[i]![j + 1]!);
      }
    }
    let i = 0;
    let j = 0;
    while (i < n || j < m) {
      if (i < n && j < m && midA[i] === midB[j]) {
        ops.push({ op: 'same', line: midA[i]! });
        i++;
        j++;
      } else if (j < m && (i === n || lcs[i]![j + 1]! >= lcs[i + 1]![j]!)) {
        ops.push({ op: 'added', line: midB[j]! });
        j++;
      } else {
        ops.push({ op: 'removed', line: midA[i]! });
        i++;
      }
    }
  }

  const rows: DiffRow[] = [];
  let ln = 1;
  let rn = 1;
  for (let k = 0; k < head; k++) rows.push({ op: 'same', left: a[k]!, right: a[k]!, leftNumber: ln++, rightNumber: rn++ });
  for (let k = 0; k < ops.length; ) {
    if (ops[k]!.op === 'same') {
      rows.push({ op: 'same', left: ops[k]!.line, right: ops[k]!.line, leftNumber: ln++, rightNumber: rn++ });
      k++;
      continue;
    }
    const removed: string[] = [];
    const added: string[] = [];
    while (k < ops.length && ops[k]!.op !== 'same') {
      (ops[k]!.op === 'removed' ? removed : added).push(ops[k]!.line);
      k++;
    }
    for (let r = 0; r < Math.max(removed.length, added.length); r++) {
      const left = removed[r] ?? null;
      const right = added[r] ?? null;
      rows.push({
        op: left !== null && right !== null ? 'removed' : left !== null ? 'removed' : 'added',
        left, right, leftNumber: left !== null ? ln++ : null, rightNumber: right !== null ? rn++ : null,
      });
    }
  }
  for (let k = a.length - tail; k < a.length; k++) rows.push({ op: 'same', left: a[k]!, right: a[k]!, leftNumber: ln++, rightNumber: rn++ });
  return rows;
}

/** Counts of lines only in the left or only in the right text. */
export function diffStats(rows: readonly DiffRow[]) {
  return {
    removed: rows.filter((r) => r.op !== 'same' && r.left !== null).length,
    added: rows.filter((r) => r.op !== 'same' && r.right !== null).length,
  };
}
