package reckoner.search;

import java.nio.file.Path;
import java.util.ArrayList;
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
 * The search collections a service serves: a {@link DataStore} of collections read from
 * collection files and indexed with Lucene, and the collection a call without {@code collection}
 * reads. A reload reads and checks every file first and swaps only when all are sound; an
 * unchanged collection (same digest) keeps its index, in memory or on disk. Thread-safe.
 */
public final class SearchStore implements AutoCloseable {
  /** The classpath folder of the demo collection files. */
  public static final String DEMO_FOLDER = "demo-search/";
  /** The demo files, in load order. */
  public static final List<String> DEMO_FILES = List.of("tarrowin.jsonl");
  /** The demo's collection, the natural default when the demo is served. */
  public static final String DEMO_DEFAULT_COLLECTION = "demo";

  /**
   * Where indexes live.
   *
   * @param indexDir the folder of on-disk indexes, one subfolder per collection and data version;
   *     empty: every index in memory
   * @param memoryMaxChars a collection whose titles and texts hold at most this many characters is
   *     indexed in memory; a larger one on disk (memory-mapped), when there is an index folder
   */
  public record Settings(Optional<Path> indexDir, long memoryMaxChars) {
    public Settings {
      Objects.requireNonNull(indexDir, "indexDir");
      if (memoryMaxChars < 0) {
        throw new IllegalArgumentException("memoryMaxChars must not be negative: " + memoryMaxChars);
      }
    }

    /** Every index in memory, none on disk. */
    public static Settings inMemory() {
      return new Settings(Optional.empty(), Long.MAX_VALUE);
    }
  }

  /** What the administration page shows of one collection. */
  public record CollectionInfo(String name, String dataVersion, int documents, long passages, String language,
      boolean onDisk) {}

  private final DataStore<Collection> data;
  private final String defaultCollection;

  private SearchStore(DataStore<Collection> data, String defaultCollection) {
    this.data = data;
    this.defaultCollection = defaultCollection;
  }

  /** The demo collection shipped with the service (collection {@code demo}). */
  public static DataSource demo() {
    return DataSource.resources(SearchStore.class.getClassLoader(), DEMO_FOLDER, DEMO_FILES);
  }

  /**
   * Loads and indexes every source and returns a store serving them.
   *
   * @param defaultCollection the collection a call without {@code collection} reads; it need not
   *     exist (such calls then answer {@code not_found})
   * @throws DataLoadException if any file has a problem; nothing is served then
   */
  public static SearchStore open(List<DataSource> sources, String defaultCollection, Settings settings,
      ReloadListener listener) throws DataLoadException {
    Objects.requireNonNull(settings, "settings");
    if (!SearchFormat.NAME.matcher(Objects.requireNonNull(defaultCollection, "defaultCollection")).matches()) {
      throw new IllegalArgumentException("default collection must match " + SearchFormat.NAME + ": " + defaultCollection);
    }
    return new SearchStore(DataStore.open("search collections", sources, () -> new SearchFormat(settings), listener),
        defaultCollection);
  }

  /** The demo collection alone, indexed in memory: for tests, benchmarks and examples. */
  public static SearchStore openDemo() {
    try {
      return open(List.of(demo()), DEMO_DEFAULT_COLLECTION, Settings.inMemory(), ReloadListener.none());
    } catch (DataLoadException e) {
      throw new IllegalStateException("the demo collection does not load: " + e.getMessage(), e);
    }
  }

  /** Reads every file again and swaps the new collections in if all are sound; never throws for bad files. */
  public ReloadReport reload() {
    return data.reload();
  }

  /** The underlying store: for the watcher and metrics. */
  public DataStore<?> data() {
    return data;
  }

  /** The collection a call without {@code collection} reads. */
  public String defaultCollection() {
    return defaultCollection;
  }

  /** The data version of every collection served now, by name. */
  public Map<String, String> dataVersions() {
    return data.dataVersions();
  }

  /** The data version of {@code collection}, if it is served. */
  public Optional<String> dataVersion(String collection) {
    return data.dataVersion(collection);
  }

  /** Every collection served now, in name order. */
  public List<CollectionInfo> collections() {
    List<CollectionInfo> all = new ArrayList<>();
    data.snapshot().all().forEach((name, c) -> all.add(
        new CollectionInfo(name, c.version(), c.records(), c.passages(), c.language().tag(), c.isOnDisk())));
    return all;
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

  /** Stops serving; every index is closed once the calls using it end. */
  @Override
  public void close() {
    data.close();
  }

  DataSnapshot<Collection> snapshot() {
    return data.snapshot();
  }
}
