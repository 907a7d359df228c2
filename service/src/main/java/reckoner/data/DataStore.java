package reckoner.data;

import java.io.IOException;
import java.util.ArrayList;
import java.util.IdentityHashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.Set;
import java.util.TreeSet;
import java.util.concurrent.atomic.AtomicLong;
import java.util.function.Supplier;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;

/**
 * Datasets loaded from {@link DataSource}s and held as one immutable {@link DataSnapshot} that a
 * reload replaces whole. A reader takes the snapshot once per call, so a call in flight finishes
 * on the data it started with. A reload parses and validates every file first and swaps only when
 * all of them are sound; otherwise the old datasets keep serving and the report says which file,
 * line and reason. Thread-safe: lookups never block; reloads run one at a time.
 */
public final class DataStore<D extends Dataset> implements AutoCloseable {
  private static final Logger LOG = LoggerFactory.getLogger(DataStore.class);

  private final String kind;
  private final List<DataSource> sources;
  private final Supplier<? extends DataFormat<D>> formats;
  private final ReloadListener listener;
  private final AtomicLong successes = new AtomicLong();
  private final AtomicLong failures = new AtomicLong();
  private final Object reloadLock = new Object();
  private volatile DataSnapshot<D> snapshot = DataSnapshot.empty();
  private volatile ReloadReport lastReport;
  private volatile Object lastFingerprint;
  private boolean closed; // guarded by reloadLock

  private DataStore(String kind, List<DataSource> sources, Supplier<? extends DataFormat<D>> formats,
      ReloadListener listener) {
    this.kind = kind;
    this.sources = sources;
    this.formats = formats;
    this.listener = listener;
  }

  /**
   * Loads every source and returns a store serving them.
   *
   * @param kind what the files hold, for logs and reports ({@code facts})
   * @param sources where the files are, in load order
   * @param formats makes the format that reads one load
   * @param listener told of this first load and of every reload
   * @throws DataLoadException if any file has a problem; nothing is served then
   */
  public static <D extends Dataset> DataStore<D> open(String kind, List<DataSource> sources,
      Supplier<? extends DataFormat<D>> formats, ReloadListener listener) throws DataLoadException {
    DataStore<D> store = new DataStore<>(Objects.requireNonNull(kind, "kind"), List.copyOf(sources),
        Objects.requireNonNull(formats, "formats"), Objects.requireNonNull(listener, "listener"));
    ReloadReport report = store.reload();
    if (!report.applied()) {
      throw new DataLoadException(report);
    }
    return store;
  }

  /**
   * Reads every file again and, if all are sound, swaps the new datasets in atomically. Returns
   * what happened; the listener is told and the outcome is logged. Never throws for bad files.
   */
  public ReloadReport reload() {
    ReloadReport report;
    synchronized (reloadLock) {
      if (closed) {
        throw new IllegalStateException("the " + kind + " store is closed");
      }
      Object fingerprint = currentFingerprint(); // before reading: a change during the read shows next time
      DataSnapshot<D> before = snapshot;
      Load<D> load = load(formats.get(), before);
      DataSnapshot<D> after = load.ok ? new DataSnapshot<>(load.datasets) : before;
      report = new ReloadReport(kind, load.ok, load.files, changes(before, after));
      if (load.ok) {
        snapshot = after;
        releaseUnused(before.all().values(), after.all().values());
        successes.incrementAndGet();
      } else {
        releaseUnused(load.datasets.values(), before.all().values()); // built for nothing
        failures.incrementAndGet();
      }
      lastFingerprint = fingerprint;
      lastReport = report;
    }
    log(report);
    try {
      listener.reloaded(report);
    } catch (RuntimeException e) {
      LOG.warn("a {} reload listener failed; the store is unaffected", kind, e);
    }
    return report;
  }

  /** The datasets served now; read once per call, so that one call sees one version. */
  public DataSnapshot<D> snapshot() {
    return snapshot;
  }

  /** The data version of every dataset served now, by name, in name order. */
  public Map<String, String> dataVersions() {
    Map<String, String> versions = new LinkedHashMap<>();
    snapshot.all().forEach((name, d) -> versions.put(name, d.version()));
    return versions;
  }

  /** The data version of {@code name}, if it is served. */
  public Optional<String> dataVersion(String name) {
    return snapshot.get(name).map(Dataset::version);
  }

  /** What the files hold, as logs and reports say it. */
  public String kind() {
    return kind;
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
  public List<DataSource> sources() {
    return sources;
  }

  /** Stops serving: every dataset is released and reloads are refused. Idempotent. */
  @Override
  public void close() {
    synchronized (reloadLock) {
      if (!closed) {
        closed = true;
        snapshot.all().values().forEach(DataStore::release);
      }
    }
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

  private record Load<D>(boolean ok, Map<String, D> datasets, List<ReloadReport.FileResult> files) {}

  private Load<D> load(DataFormat<D> format, DataSnapshot<D> previous) {
    List<ReloadReport.FileResult> unreadable = new ArrayList<>();
    List<DataSource.Input> inputs = new ArrayList<>();
    for (DataSource source : sources) {
      try {
        inputs.addAll(source.inputs());
      } catch (IOException e) {
        unreadable.add(new ReloadReport.FileResult(source.toString(), 0,
            List.of(new ReloadReport.Problem(source.toString(), 0, "cannot list the files: " + e.getMessage()))));
      }
    }
    Map<String, FileProblems> problems = new LinkedHashMap<>();
    Map<String, int[]> records = new LinkedHashMap<>();
    int[] total = {0};
    for (DataSource.Input input : inputs) {
      FileProblems p = problems.computeIfAbsent(input.name(), FileProblems::new);
      int[] count = records.computeIfAbsent(input.name(), n -> new int[1]);
      DataFiles.read(input, format.maxLineBytes(), line -> {
        if (format.read(line)) {
          count[0]++;
        }
      }, (line, reason) -> {
        p.add(line, reason);
        total[0]++;
      });
    }
    DataFormat.ProblemSink sink = new DataFormat.ProblemSink() {
      @Override
      public void add(String file, int line, String reason) {
        problems.computeIfAbsent(file, FileProblems::new).add(line, reason);
        total[0]++;
      }

      @Override
      public int count() {
        return total[0] + unreadable.size();
      }
    };
    Map<String, D> datasets = format.assemble(new DataFormat.Assembly<>(List.copyOf(inputs), sink, previous));
    List<ReloadReport.FileResult> files = new ArrayList<>(unreadable);
    problems.forEach((file, p) -> files.add(new ReloadReport.FileResult(file,
        records.containsKey(file) ? records.get(file)[0] : 0, p.list())));
    return new Load<>(sink.count() == 0, datasets, files);
  }

  private List<ReloadReport.Change> changes(DataSnapshot<D> before, DataSnapshot<D> after) {
    TreeSet<String> names = new TreeSet<>(before.all().keySet());
    names.addAll(after.all().keySet());
    List<ReloadReport.Change> changes = new ArrayList<>();
    for (String name : names) {
      Optional<D> b = before.get(name);
      Optional<D> a = after.get(name);
      changes.add(new ReloadReport.Change(name, b.map(Dataset::version), a.map(Dataset::version),
          a.or(() -> b).map(Dataset::records).orElse(0)));
    }
    return changes;
  }

  /** Releases every dataset of {@code dropped} that {@code kept} does not hold (by identity). */
  private static <D extends Dataset> void releaseUnused(Iterable<D> dropped, Iterable<D> kept) {
    Set<D> keep = java.util.Collections.newSetFromMap(new IdentityHashMap<>());
    kept.forEach(keep::add);
    for (D d : dropped) {
      if (!keep.contains(d)) {
        release(d);
      }
    }
  }

  private static void release(Dataset d) {
    try {
      d.release();
    } catch (RuntimeException e) {
      LOG.warn("releasing a dataset failed", e);
    }
  }

  private void log(ReloadReport report) {
    if (report.applied()) {
      LOG.info(report.summary());
      return;
    }
    LOG.warn(report.summary());
    report.problems().forEach(p -> LOG.warn("{} file problem: {}", kind, p));
  }
}
