/**
 * {@code data}: the one home of versioned, reloadable data that tools answer from (fact sets,
 * search collections). Reads JSON Lines files from directories or the classpath ({@link
 * reckoner.data.DataSource}, {@link reckoner.data.DataFiles}, with Jackson), hands each line to a
 * family's {@link reckoner.data.DataFormat}, serves the datasets it builds behind one atomically
 * swapped {@link reckoner.data.DataSnapshot} ({@link reckoner.data.DataStore}), reloads on demand
 * or on file change ({@link reckoner.data.DataWatcher}) and reports every file, line and reason
 * ({@link reckoner.data.ReloadReport}). {@link reckoner.data.ContentDigest} makes the {@code
 * data_version} digests.
 *
 * <p>Design notes: depends on the JDK, Jackson (data files only, never requests), SLF4J (reload
 * logs), {@code reckoner.io} (line splitting) and {@code reckoner.tool} (the one-line text rule).
 * A bad file never replaces good data: a reload swaps only when every file is sound.
 */
package reckoner.data;
