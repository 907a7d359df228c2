package reckoner.facts;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.TreeSet;
import java.util.concurrent.atomic.AtomicLong;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;

/**
 * The fact sets a service serves, loaded from {@link FactSource}s and held as one immutable
 * snapshot that a reload replaces whole. A reader takes the snapshot once per call, so a call in
 * flight finishes on the data it started with. A reload parses and validates every file first and
 * swaps only when all of them are sound; otherwise the old sets keep serving and the report says
 * which file, line and reason. Thread-safe: lookups never block; reloads run one at a time.
 */
public final class FactStore {
  private static final Logger LOG = LoggerFactory.getLogger(FactStore.class);

  private final List<FactSource> sources;
  private final String defaultSet;
  private final ReloadListener listener;
  private final AtomicLong successes = new AtomicLong();
  private final AtomicLong failures = new AtomicLong();
  private final Object reloadLock = new Object();
  private volatile Snapshot snapshot = Snapshot.EMPTY;
  private volatile ReloadReport lastReport;
  private volatile Object lastFingerprint;

  private FactStore(List<FactSource> sources, String defaultSet, ReloadListener listener) {
    this.sources = sources;
    this.defaultSet = defaultSet;
    this.listener = listener;
  }

  /** Opens a store over {@code sources} with no listener; see {@link #open(List, String, ReloadListener)}. */
  public static FactStore open(List<FactSource> sources, String defaultSet) throws FactLoadException {
    return open(sources, defaultSet, ReloadListener.none());
  }

  /**
   * Loads every source and returns a store serving them.
   *
   * @param sources where the fact files are, in load order
   * @param defaultSet the set a call without {@code set} reads; it need not exist (such calls then
   *     answer {@code not_found})
   * @param listener told of this first load and of every reload
   * @throws FactLoadException if any file has a problem; nothing is served then
   */
  public static FactStore open(List<FactSource> sources, String defaultSet, ReloadListener listener)
      throws FactLoadException {
    Objects.requireNonNull(listener, "listener");
    if (!FactFileReader.SET_NAME.matcher(Objects.requireNonNull(defaultSet, "defaultSet")).matches()) {
      throw new IllegalArgumentException("default set must match " + FactFileReader.SET_NAME + ": " + defaultSet);
    }
    FactStore store = new FactStore(List.copyOf(sources), defaultSet, listener);
    ReloadReport report = store.reload();
    if (!report.applied()) {
      throw new FactLoadException(report);
    }
    return store;
  }

  /**
   * Reads every file again and, if all are sound, swaps the new sets in atomically. Returns what
   * happened; the listener is told and the outcome is logged. Never throws for bad files.
   */
  public ReloadReport reload() {
    ReloadReport report;
    synchronized (reloadLock) {
      FactLoader.Result result = FactLoader.load(sources);
      Snapshot before = snapshot;
      Snapshot after = result.isOk() ? result.snapshot() : before;
      report = new ReloadReport(result.isOk(), result.files(), changes(before, after));
      if (result.isOk()) {
        snapshot = after;
        successes.incrementAndGet();
      } else {
        failures.incrementAndGet();
      }
      lastFingerprint = result.fingerprint();
      lastReport = report;
    }
    log(report);
    try {
      listener.reloaded(report);
    } catch (RuntimeException e) {
      LOG.warn("a fact reload listener failed; the store is unaffected", e);
    }
    return report;
  }

  /** The set a call without {@code set} reads. */
  public String defaultSet() {
    return defaultSet;
  }

  /** The data version of every set served now, by set name. */
  public Map<String, String> dataVersions() {
    Map<String, String> versions = new LinkedHashMap<>();
    snapshot.sets().forEach((name, set) -> versions.put(name, set.version()));
    return versions;
  }

  /** The data version of {@code set}, if it is served. */
  public Optional<String> dataVersion(String set) {
    return snapshot.set(set).map(FactSet::version);
  }

  /** How many loads and reloads were applied, counting the first. */
  public long reloadSuccesses() {
    return successes.get();
  }

  /** How many reloads were refused because a file had a problem. */
  public long reloadFailures() {
    return failures.get();
  }

  /** The report of the latest load or reload. */
  public ReloadReport lastReport() {
    return lastReport;
  }

  /** The sources, in load order. */
  public List<FactSource> sources() {
    return sources;
  }

  Snapshot snapshot() {
    return snapshot;
  }

  /** The sources' fingerprint as of the latest reload attempt (for the watcher). */
  Object lastFingerprint() {
    return lastFingerprint;
  }

  /** The sources' fingerprint now. */
  Object currentFingerprint() {
    List<Object> parts = new ArrayList<>();
    sources.forEach(s -> parts.add(s.fingerprint()));
    return parts;
  }

  private static List<ReloadReport.SetChange> changes(Snapshot before, Snapshot after) {
    TreeSet<String> names = new TreeSet<>(before.sets().keySet());
    names.addAll(after.sets().keySet());
    List<ReloadReport.SetChange> changes = new ArrayList<>();
    for (String name : names) {
      Optional<FactSet> b = before.set(name);
      Optional<FactSet> a = after.set(name);
      changes.add(new ReloadReport.SetChange(name, b.map(FactSet::version), a.map(FactSet::version),
          a.or(() -> b).map(FactSet::factCount).orElse(0)));
    }
    return changes;
  }

  private static void log(ReloadReport report) {
    if (report.applied()) {
      LOG.info(report.summary());
      return;
    }
    LOG.warn(report.summary());
    report.problems().forEach(p -> LOG.warn("fact file problem: {}", p));
  }
}
