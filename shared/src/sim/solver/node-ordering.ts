/**
 * Reverse Cuthill–McKee ordering of a symmetric structure (E. Cuthill and J. McKee, Proc. 24th ACM
 * National Conference, 1969; reversal after A. George, 1971). A ladder's unknowns come out in ladder order,
 * so its matrix has a bandwidth independent of the cell count.
 * Returns `positionOf[unknown]`, a permutation of 0..size−1.
 */
export function reverseCuthillMcKee(size: number, edges: ReadonlyArray<readonly [number, number]>): Int32Array {
  const neighbours: number[][] = Array.from({ length: size }, () => []);
  for (const [i, j] of edges) {
    if (i < 0 || j < 0 || i === j) continue;
    neighbours[i]!.push(j);
    neighbours[j]!.push(i);
  }
  const degree = neighbours.map((list) => new Set(list).size);
  const visited = new Uint8Array(size);
  const order: number[] = [];
  while (order.length < size) {
    let start = -1;
    for (let i = 0; i < size; i++) {
      if (!visited[i] && (start < 0 || degree[i]! < degree[start]!)) start = i;
    }
    // Move to a pseudo-peripheral node: the last one reached by a breadth-first sweep.
    for (let sweep = 0; sweep < 2; sweep++) {
      const seen = new Uint8Array(size);
      let frontier = [start];
      seen[start] = 1;
      let last = start;
      while (frontier.length > 0) {
        const next: number[] = [];
        for (const u of frontier) {
          for (const v of neighbours[u]!) {
            if (!seen[v] && !visited[v]) {
              seen[v] = 1;
              next.push(v);
            }
          }
        }
        if (next.length > 0) last = next.reduce((m, v) => (degree[v]! < degree[m]! ? v : m), next[0]!);
        frontier = next;
      }
      start = last;
    }
    const queue = [start];
    visited[start] = 1;
    for (let head = 0; head < queue.length; head++) {
      const u = queue[head]!;
      order.push(u);
      const fresh = [...new Set(neighbours[u])].filter((v) => !visited[v]).sort((p, q) => degree[p]! - degree[q]!);
      for (const v of fresh) {
        visited[v] = 1;
        queue.push(v);
      }
    }
  }
  const positionOf = new Int32Array(size);
  order.reverse().forEach((unknown, position) => {
    positionOf[unknown] = position;
  });
  return positionOf;
}
