/**
 * {@code facts}: versioned key-value fact sets loaded from JSON Lines files, looked up by
 * Unicode-normalised keys, with values scoped to dates and a content digest on every answer.
 *
 * <p>Public: {@link reckoner.facts.FactsTool} (the {@code facts@1} tool) and {@link
 * reckoner.facts.FactStore} (the loaded sets, reloads and the default set). The file format, the
 * index and the suggestion search are package-private. Files, reloads, watching and reports are
 * {@code reckoner.data}'s.
 *
 * <p>Design notes: depends on {@code reckoner.tool}, {@code reckoner.data}, ICU4J (normalisation)
 * and commons-text (edit distance) only; never on Jackson, HTTP, metrics or the ledger. Nothing
 * here reads the clock except {@code FactsTool}, through its {@code CallContext}, and only for a
 * time-scoped key asked without {@code as_of}.
 */
package reckoner.facts;
