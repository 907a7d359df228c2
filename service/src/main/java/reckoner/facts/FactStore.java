package reckoner.facts;

import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import reckoner.data.DataLoadException;
import reckoner.data.DataSnapshot;
import reckoner.data.DataSource;
import reckoner.data.DataStore;
import reckoner.data.ReloadListener;
import reckoner.data.ReloadReport;

/**
 * The fact sets a service serves: a {@link DataStore} of {@link FactSet}s read from fact files,
 * and the set a call without {@code set} reads. A reload parses and validates every file first and
 * swaps only when all of them are sound. Thread-safe: lookups never block; reloads run one at a time.
 */
public final class FactStore {
  /** The classpath folder of the demo fact files. */
  public static final String DEMO_FOLDER = "demo-facts/";
  /** The demo files, in load order. */
  public static final List<String> DEMO_FILES = List.of("tarrowin.jsonl", "tarrowin-words.jsonl");
  /** The name of the demo's main set, the natural default set when the demo is served. */
  public static final String DEMO_DEFAULT_SET = "demo";

  private final DataStore<FactSet> data;
  private final String defaultSet;

  private FactStore(DataStore<FactSet> data, String defaultSet) {
    this.data = data;
    this.defaultSet = defaultSet;
  }

  /** The demo fact sets shipped with the service (sets {@code demo} and {@code demo-words}). */
  public static DataSource demo() {
    return DataSource.resources(FactStore.class.getClassLoader(), DEMO_FOLDER, DEMO_FILES);
  }

  /** Opens a store over {@code sources} with no listener; see {@link #open(List, String, ReloadListener)}. */
  public static FactStore open(List<DataSource> sources, String defaultSet) throws DataLoadException {
    return open(sources, defaultSet, ReloadListener.none());
  }

  /**
   * Loads every source and returns a store serving them.
   *
   * @param sources where the fact files are, in load order
   * @param defaultSet the set a call without {@code set} reads; it need not exist (such calls then
   *     answer {@code not_found})
   * @param listener told of this first load and of every reload
   * @throws DataLoadException if any file has a problem; nothing is served then
   */
  public static FactStore open(List<DataSource> sources, String defaultSet, ReloadListener listener)
      throws DataLoadException {
    Objects.requireNonNull(listener, "listener");
    if (!FactsFormat.SET_NAME.matcher(Objects.requireNonNull(defaultSet, "defaultSet")).matches()) {
      throw new IllegalArgumentException("default set must match " + FactsFormat.SET_NAME + ": " + defaultSet);
    }
    return new FactStore(DataStore.open("facts", sources, FactsFormat::new, listener), defaultSet);
  }

  /**
   * Reads every file again and, if all are sound, swaps the new sets in atomically. Returns what
   * happened; never throws for bad files.
   */
  public ReloadReport reload() {
    return data.reload();
  }

  /** The underlying store: for the watcher, metrics and administration. */
  public DataStore<?> data() {
    return data;
  }

  /** The set a call without {@code set} reads. */
  public String defaultSet() {
    return defaultSet;
  }

  /** The data version of every set served now, by set name. */
  public Map<String, String> dataVersions() {
    return data.dataVersions();
  }

  /** The data version of {@code set}, if it is served. */
  public Optional<String> dataVersion(String set) {
    return data.dataVersion(set);
  }

  /** How many loads and reloads were applied, counting the first. */
  public long reloadSuccesses() {
    return data.reloadSuccesses();
  }

  /** How many reloads were refused because a file had a problem. */
  public long reloadFailures() {
    return data.reloadFailures();
  }

  /** The report of the latest load or reload. */
  public ReloadReport lastReport() {
    return data.lastReport();
  }

  DataSnapshot<FactSet> snapshot() {
    return data.snapshot();
  }
}
