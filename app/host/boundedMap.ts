/**
 * Map over items with at most `limit` calls of `run` in flight at once, the
 * results in the items' order. The case store reads a workspace's files this
 * way, so the disk works while the CPU validates and computes the files
 * already read, without opening a thousand files at once.
 *
 * @param items - what to map
 * @param limit - the most calls in flight at once (at least 1)
 * @param run - the asynchronous work for one item (with its index)
 * @returns the results, result i for item i
 * @example await boundedMap(['a.json', 'b.json'], 8, (name) => store.open(name)) → [opened a, opened b]
 */
export async function boundedMap<Item, Value>(items: readonly Item[], limit: number, run: (item: Item, index: number) => Promise<Value>): Promise<Value[]> {
  const results = new Array<Value>(items.length);
  let next = 0;
  const lane = async (): Promise<void> => {
    while (next < items.length) {
      const index = next;
      next += 1;
      results[index] = await run(items[index]!, index);
    }
  };
  await Promise.all(Array.from({ length: Math.max(1, Math.min(limit, items.length)) }, lane));
  return results;
}
