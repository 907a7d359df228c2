/**
 * {@code facts}: versioned key-value fact sets loaded from JSON Lines files, looked up by
 * Unicode-normalised keys, with values scoped to dates and a content digest on every answer.
 *
 * <p>Public: {@link reckoner.facts.FactsTool} (the {@code facts@1} tool), {@link
 * reckoner.facts.FactStore} (the loaded sets behind one atomically swapped snapshot, and reloads),
 * {@link reckoner.facts.FactSource}, {@link reckoner.facts.FactsWatcher} (reload on file change),
 * {@link reckoner.facts.ReloadReport}, {@link reckoner.facts.ReloadListener} and {@link
 * reckoner.facts.FactLoadException}. The file reader, the JSON line reader, the index and the
 * suggestion search are package-private.
 *
 * <p>Design notes: depends on {@code reckoner.tool}, ICU4J (normalisation), commons-text (edit
 * distance) and SLF4J (reload logs) only; never on Jackson, HTTP, metrics or the ledger. Metrics
 * are fed through {@link reckoner.facts.ReloadListener} and the store's counters. Nothing here
 * reads the clock except {@code FactsTool}, through its {@code CallContext}, and only for a
 * time-scoped key asked without {@code as_of}.
 */
package reckoner.facts;
