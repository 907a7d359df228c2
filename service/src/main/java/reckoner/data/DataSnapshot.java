package reckoner.data;

import java.util.Collections;
import java.util.Map;
import java.util.Optional;
import java.util.TreeMap;

/** Every dataset a store serves at one moment, by name. Immutable; a reload swaps in a new one whole. */
public final class DataSnapshot<D extends Dataset> {
  private final Map<String, D> datasets;

  DataSnapshot(Map<String, D> datasets) {
    this.datasets = Collections.unmodifiableMap(new TreeMap<>(datasets));
  }

  static <D extends Dataset> DataSnapshot<D> empty() {
    return new DataSnapshot<>(Map.of());
  }

  /** The dataset called {@code name}, if served. */
  public Optional<D> get(String name) {
    return Optional.ofNullable(datasets.get(name));
  }

  /** The datasets by name, in name order; unmodifiable. */
  public Map<String, D> all() {
    return datasets;
  }
}
