package reckoner;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.UUID;
import reckoner.call.AnswerCache;
import reckoner.call.InvocationIds;
import reckoner.call.InvocationSink;
import reckoner.call.Invoker;
import reckoner.ledger.LedgerSink;
import reckoner.ledger.LedgerStats;
import reckoner.ledger.LedgerStore;
import reckoner.ledger.LedgerWriter;
import reckoner.ledger.Retention;
import reckoner.config.ConfigException;
import reckoner.config.ServiceConfig;
import reckoner.data.DataLoadException;
import reckoner.data.DataSource;
import reckoner.facts.FactStore;
import reckoner.search.SearchStore;
import reckoner.spec.SpecLoader;
import reckoner.spec.ToolCatalog;
import reckoner.splice.Markup;
import reckoner.tool.ToolRegistry;
import tools.jackson.databind.json.JsonMapper;

/**
 * The call engine that the HTTP service and the offline command line share: the served tools with
 * their specs, the fact store, the answer cache, the invoker and the configured markup. Wiring only.
 */
record Engine(ToolCatalog catalog, AnswerCache cache, Invoker invoker, Markup markup, FactStore facts,
    SearchStore search, LedgerStore ledger, LedgerWriter writer, Retention retention) implements AutoCloseable {
  static Engine build(ServiceConfig config, Clock clock, JsonMapper json, LedgerStats.CommitListener commits) {
    FactStore facts = openFacts(config);
    SearchStore search = openSearch(config);
    LedgerStore ledger = openLedger(config);
    LedgerWriter writer = LedgerWriter.start(ledger, LedgerWriter.Settings.defaults().withQueueCapacity(config.ledgerQueue()),
        commits);
    Retention.Policy policy = new Retention.Policy(config.retentionDays() > 0 ? Duration.ofDays(config.retentionDays()) : null,
        config.retentionMaxRecords(), config.retentionMaxBytes());
    Retention retention = policy.keepsAll() ? null : Retention.start(ledger, policy, clock, Duration.ofMinutes(1));
    InvocationSink sink = new LedgerSink(writer,
        LedgerSink.Durability.parse(config.durability()).orElseThrow(() -> new ConfigException("durability: " + config.durability())));
    ToolCatalog catalog = ToolCatalog.of(ToolRegistry.of(Tools.standard(facts, search)), new SpecLoader(json));
    AnswerCache cache = AnswerCache.ofMaximumSize(config.cacheSize());
    Markup markup;
    try {
      markup = new Markup(config.markupOpen(), config.markupSeparator(), config.markupClose());
    } catch (IllegalArgumentException e) {
      throw new ConfigException("markup-open, markup-separator, markup-close: " + e.getMessage());
    }
    InvocationIds ids = new InvocationIds(clock);
    ledger.newestBeyond(0).ifPresent(newest -> ids.startAfter(UUID.fromString(newest))); // ids keep rising across restarts
    Invoker.Limits limits = new Invoker.Limits(config.bounds().maxArgumentChars(),
        java.util.concurrent.TimeUnit.MILLISECONDS.toNanos(config.bounds().callDeadlineMillis()));
    return new Engine(catalog, cache, new Invoker(catalog, clock, ids, cache, sink, limits), markup, facts, search, ledger, writer,
        retention);
  }

  /** The tools and their specs over the settings' fact sets and collections, without a ledger: for the audit of an export. */
  static ToolCatalog catalogOnly(ServiceConfig config, JsonMapper json) {
    return ToolCatalog.of(ToolRegistry.of(Tools.standard(openFacts(config), openSearch(config))), new SpecLoader(json));
  }

  /** The ledger store the settings name, its schema created or migrated. */
  static LedgerStore openLedger(ServiceConfig config) {
    try {
      if (config.ledger().equals("postgresql")) {
        return LedgerStore.postgres(config.ledgerUrl(), blankToNull(config.ledgerUser()), blankToNull(config.ledgerPassword()),
            config.ledgerPoolSize());
      }
      Files.createDirectories(config.dataDir());
      return LedgerStore.sqlite(config.dataDir(), config.ledgerSync());
    } catch (java.io.IOException | RuntimeException e) {
      throw new ConfigException("the ledger (" + config.ledger() + ") cannot be opened: " + e.getMessage());
    }
  }

  private static String blankToNull(String s) {
    return s == null || s.isBlank() ? null : s;
  }

  /** Whether calls can be recorded now: readiness. */
  boolean isReady() {
    return !catalog.all().isEmpty() && writer.isHealthy();
  }

  /** Stops retention, drains the ledger queue (every accepted record is written), closes the store. */
  @Override
  public void close() {
    if (retention != null) {
      retention.close();
    }
    writer.close();
    ledger.close();
    search.close();
  }

  /**
   * The fact sets: the demo (unless turned off), {@code <data dir>/facts} (created if missing), and every
   * {@code facts-dirs} entry (which must exist). A bad file stops the start, naming file and line.
   */
  static FactStore openFacts(ServiceConfig config) {
    List<DataSource> sources = sources(config.factsDemo() ? FactStore.demo() : null, config.dataDir().resolve("facts"),
        config.factsDirs(), "facts-dirs");
    try {
      return FactStore.open(sources, config.factsDefaultSet()); // the store logs each load itself
    } catch (DataLoadException e) {
      throw new ConfigException("fact files could not be loaded: " + e.getMessage());
    } catch (IllegalArgumentException e) {
      throw new ConfigException("facts-default-set: " + e.getMessage());
    }
  }

  /**
   * The search collections: the demo (unless turned off), {@code <data dir>/search} (created if
   * missing), and every {@code search-dirs} entry (which must exist); on-disk indexes under {@link
   * ServiceConfig#searchIndexPath()}. A bad file stops the start, naming file and line.
   */
  static SearchStore openSearch(ServiceConfig config) {
    List<DataSource> sources = sources(config.searchDemo() ? SearchStore.demo() : null, config.dataDir().resolve("search"),
        config.searchDirs(), "search-dirs");
    SearchStore.Settings settings = new SearchStore.Settings(java.util.Optional.of(config.searchIndexPath()),
        config.searchMemoryChars());
    try {
      return SearchStore.open(sources, config.searchDefaultCollection(), settings, reckoner.data.ReloadListener.none());
    } catch (DataLoadException e) {
      throw new ConfigException("search collection files could not be loaded: " + e.getMessage());
    } catch (IllegalArgumentException e) {
      throw new ConfigException("search-default-collection: " + e.getMessage());
    }
  }

  /**
   * A data-backed family's sources: its demo (null when turned off), its own folder in the data dir
   * (created if missing: always a source, so files dropped in later load on reload), and each of the
   * setting's directories, which must exist.
   */
  private static List<DataSource> sources(DataSource demo, Path own, List<Path> dirs, String setting) {
    List<DataSource> sources = new ArrayList<>();
    if (demo != null) {
      sources.add(demo);
    }
    try {
      Files.createDirectories(own);
    } catch (java.io.IOException e) {
      throw new ConfigException("data-dir: cannot create " + own + ": " + e.getMessage());
    }
    sources.add(DataSource.directory(own));
    for (Path dir : dirs) {
      if (!Files.isDirectory(dir)) {
        throw new ConfigException(setting + ": no such directory: " + dir);
      }
      sources.add(DataSource.directory(dir));
    }
    return sources;
  }

  /** Threads for parallel calls: the configured count, or one per core. */
  static int callThreads(ServiceConfig config) {
    return config.callThreads() == 0 ? Runtime.getRuntime().availableProcessors() : config.callThreads();
  }
}
