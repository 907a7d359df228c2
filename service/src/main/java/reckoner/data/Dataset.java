package reckoner.data;

/**
 * One named, versioned unit of loaded data (a fact set, a search collection), as a {@link
 * DataStore} serves it. Implementations are immutable and thread-safe.
 */
public interface Dataset {
  /** The content digest, {@code sha256:} and 16 hex digits. */
  String version();

  /** How many records it holds (facts, documents), for reports. */
  int records();

  /**
   * Called once when the store stops serving this dataset (a reload replaced it, or the store
   * closed); calls already holding it may still be running. Frees what a dataset holds outside
   * the heap. Does nothing by default.
   */
  default void release() {}
}
