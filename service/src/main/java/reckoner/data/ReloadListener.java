package reckoner.data;

/**
 * Told of every load and reload of a {@link DataStore}, applied or not: the hook for metrics,
 * alerts and cache invalidation. Called on the thread that reloaded, after the swap; an exception
 * thrown here is logged and does not affect the store.
 */
@FunctionalInterface
public interface ReloadListener {
  void reloaded(ReloadReport report);

  /** A listener that does nothing. */
  static ReloadListener none() {
    return report -> {};
  }
}
