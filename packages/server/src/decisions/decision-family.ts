/**
 * The key that tells one family of plant variants from another, for superseding and for the
 * ?family= filter: its plant revisions, each once, sorted and joined with "+". Two studies on the
 * same revisions are the same family whatever their labels or order. The only place that defines a
 * family's identity: switch it here when families are saved in the library.
 */
export function decisionFamilyKey(revisionIds: readonly string[]): string {
  if (revisionIds.length === 0) throw new RangeError("revisionIds: a family has at least one plant revision");
  return [...new Set(revisionIds)].sort().join("+");
}
