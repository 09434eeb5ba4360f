/**
 * The chance that `drawn` tiles taken at random from a set of `setSize` hold at least one of
 * `copies` alike (a hypergeometric tail): one minus the chance that every draw misses.
 */
export function chanceOfAtLeastOne(copies: number, drawn: number, setSize: number): number {
  let missAll = 1;
  for (let i = 0; i < drawn; i++) missAll *= (setSize - copies - i) / (setSize - i);
  return 1 - missAll;
}
