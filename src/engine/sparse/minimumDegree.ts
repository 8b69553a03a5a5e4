// Fill-reducing ordering by minimum degree on the explicit elimination graph. Power networks are sparse and
// nearly planar, so the cliques formed stay small; the eliminated neighbour sets are the column patterns of L,
// which makes this step the symbolic factorisation as well.

export interface Ordering {
  /** perm[newIndex] = oldIndex */
  perm: Int32Array;
  /** inv[oldIndex] = newIndex */
  inv: Int32Array;
  /** Column pattern of L (strictly below the diagonal) in new indices, CSC with sorted rows. */
  colPtr: Int32Array;
  rowIdx: Int32Array;
}

/** Orders the symmetric pattern given as neighbour lists (no self loops, duplicates allowed). */
export function minimumDegree(n: number, neighbours: ArrayLike<number>[]): Ordering {
  const adj: Set<number>[] = [];
  for (let i = 0; i < n; i++) adj.push(new Set());
  for (let i = 0; i < n; i++) {
    const list = neighbours[i];
    for (let k = 0; k < list.length; k++) {
      const j = list[k];
      if (j !== i) {
        adj[i].add(j);
        adj[j].add(i);
      }
    }
  }
  // Binary heap of (degree, node) with lazy deletion.
  const heapDeg: number[] = [];
  const heapNode: number[] = [];
  const push = (d: number, v: number) => {
    let i = heapDeg.length;
    heapDeg.push(d);
    heapNode.push(v);
    while (i > 0) {
      const p = (i - 1) >> 1;
      if (heapDeg[p] < d || (heapDeg[p] === d && heapNode[p] <= v)) break;
      heapDeg[i] = heapDeg[p];
      heapNode[i] = heapNode[p];
      i = p;
    }
    heapDeg[i] = d;
    heapNode[i] = v;
  };
  const pop = (): [number, number] => {
    const d0 = heapDeg[0];
    const v0 = heapNode[0];
    const d = heapDeg.pop() as number;
    const v = heapNode.pop() as number;
    const len = heapDeg.length;
    if (len > 0) {
      let i = 0;
      for (;;) {
        const l = 2 * i + 1;
        if (l >= len) break;
        const r = l + 1;
        let c = l;
        if (r < len && (heapDeg[r] < heapDeg[l] || (heapDeg[r] === heapDeg[l] && heapNode[r] < heapNode[l]))) c = r;
        if (heapDeg[c] > d || (heapDeg[c] === d && heapNode[c] >= v)) break;
        heapDeg[i] = heapDeg[c];
        heapNode[i] = heapNode[c];
        i = c;
      }
      heapDeg[i] = d;
      heapNode[i] = v;
    }
    return [d0, v0];
  };
  for (let i = 0; i < n; i++) push(adj[i].size, i);

  const done = new Uint8Array(n);
  const perm = new Int32Array(n);
  const inv = new Int32Array(n);
  const patterns: number[][] = [];
  let step = 0;
  while (step < n) {
    const [d, v] = pop();
    if (done[v] || d !== adj[v].size) continue;
    done[v] = 1;
    perm[step] = v;
    inv[v] = step;
    const nb = [...adj[v]];
    patterns.push(nb);
    for (const a of nb) adj[a].delete(v);
    for (let x = 0; x < nb.length; x++) {
      const sa = adj[nb[x]];
      for (let y = x + 1; y < nb.length; y++) {
        if (!sa.has(nb[y])) {
          sa.add(nb[y]);
          adj[nb[y]].add(nb[x]);
        }
      }
    }
    for (const a of nb) push(adj[a].size, a);
    adj[v].clear();
    step++;
  }
  const colPtr = new Int32Array(n + 1);
  for (let k = 0; k < n; k++) colPtr[k + 1] = colPtr[k] + patterns[k].length;
  const rowIdx = new Int32Array(colPtr[n]);
  for (let k = 0; k < n; k++) {
    const rows = patterns[k].map((old) => inv[old]).sort((a, b) => a - b);
    rowIdx.set(rows, colPtr[k]);
  }
  return { perm, inv, colPtr, rowIdx };
}
