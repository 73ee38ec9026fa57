/**
 * The groups of correlated inputs: the connected components of the graph whose
 * edges are the pairs with r(x_i, x_j) ≠ 0 (JCGM 100:2008 5.2). Inputs in
 * different groups are uncorrelated, so the combined variance is the sum of the
 * groups' variances. An uncorrelated input is a group of its own. Groups are
 * listed by their first input, members in input order.
 */
export function correlationGroups(n: number, correlation: readonly (readonly number[])[] | null): number[][] {
  const group = new Array<number>(n).fill(-1);
  const groups: number[][] = [];
  for (let start = 0; start < n; start++) {
    if (group[start] >= 0) continue;
    const members = [start];
    group[start] = groups.length;
    for (let k = 0; k < members.length; k++) {
      const i = members[k];
      if (!correlation) break;
      for (let j = 0; j < n; j++) {
        if (j !== i && group[j] < 0 && correlation[i][j] !== 0) {
          group[j] = groups.length;
          members.push(j);
        }
      }
    }
    groups.push(members.sort((a, b) => a - b));
  }
  return groups;
}
