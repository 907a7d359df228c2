package reckoner.config;

import java.io.IOException;
import java.io.Reader;
import java.net.InetAddress;
import java.net.UnknownHostException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Properties;
import java.util.Set;
import java.util.TreeSet;

/**
 * The service's settings, validated once at start. Each setting has one name, used alike as a
 * command-line flag ({@code --data-dir}), an environment variable ({@code RECKONER_DATA_DIR}) and
 * a key in the optional properties file ({@code data-dir=...}). Precedence, highest first: flag,
 * environment, file, default. Immutable.
 *
 * @param host address to listen on; loopback by default (no keys file: loopback only)
 * @param port TCP port, 0 for any free port
 * @param dataDir the directory that holds the ledger and {@code facts/}
 * @param maxBodyBytes largest request body accepted, in bytes
 * @param openAccess whether to listen on a non-loopback address without API keys (explicit opt-in)
 * @param maxBatchBytes largest JSON batch, splice or fill body, and longest NDJSON line
 * @param cacheSize most answers kept in the answer cache (0 turns it off)
 * @param callThreads threads that run batch calls (0: one per core)
 * @param markupOpen the server's splice markup: opening string
 * @param markupSeparator the server's splice markup: separator before an answer
 * @param markupClose the server's splice markup: closing string
 * @param factsDirs more directories of fact files, beside {@code <data dir>/facts}
 * @param factsDemo whether the shipped demo fact sets are served too
 * @param factsDefaultSet the fact set a call without {@code set} reads
 * @param factsPollMillis how often fact files are checked for changes (0: only on an admin reload)
 * @param ledger where invocations are kept: {@code sqlite} (a file in the data dir) or {@code postgresql}
 * @param ledgerUrl the JDBC URL of the PostgreSQL ledger
 * @param ledgerUser the PostgreSQL user (may be empty: from the URL)
 * @param ledgerPassword the PostgreSQL password (may be empty: from the URL)
 * @param ledgerPoolSize PostgreSQL connections at most
 * @param ledgerSync whether SQLite syncs every commit to the disk (survives power loss) or not (survives a crash)
 * @param durability {@code commit} (an answer leaves after its record is committed) or {@code async}
 * @param ledgerQueue records queued for the ledger writer at most
 * @param retentionDays records older than this many days are deleted (0: kept)
 * @param retentionMaxRecords the oldest records beyond this count are deleted (0: no limit)
 * @param retentionMaxBytes the oldest records are deleted while the ledger's records take more bytes than this (0: no limit)
 * @param searchDirs more directories of search collection files, beside {@code <data dir>/search}
 * @param searchDemo whether the shipped demo collection is served too
 * @param searchDefaultCollection the collection a search call without {@code collection} reads
 * @param searchPollMillis how often collection files are checked for changes (0: only on an admin reload)
 * @param searchIndexDir where on-disk indexes live (empty: {@code <data dir>/search-index})
 * @param searchMemoryChars collections of at most this many characters are indexed in memory, larger ones on disk
 * @param accessLog whether every HTTP request is logged as one line (logger {@code reckoner.access})
 * @param access API keys and their limits
 * @param bounds the bounds on each request's work
 */
public record ServiceConfig(String host, int port, Path dataDir, long maxBodyBytes, boolean openAccess,
    long maxBatchBytes, long cacheSize, int callThreads, String markupOpen, String markupSeparator, String markupClose,
    List<Path> factsDirs, boolean factsDemo, String factsDefaultSet, long factsPollMillis,
    String ledger, String ledgerUrl, String ledgerUser, String ledgerPassword, int ledgerPoolSize, boolean ledgerSync,
    String durability, int ledgerQueue, long retentionDays, long retentionMaxRecords,
    long retentionMaxBytes, List<Path> searchDirs, boolean searchDemo, String searchDefaultCollection,
    long searchPollMillis, String searchIndexDir, long searchMemoryChars, boolean accessLog, Access access, Bounds bounds) {

  /**
   * API keys: the keys file (null: none, and the server listens on loopback only), how often it is
   * checked for changes, how many seconds of its rate a key may spend at once, and how many NDJSON
   * streams a key may have open.
   */
  public record Access(Path keysFile, long keysPollMillis, double rateBurstSeconds, int maxStreamsPerKey) {
    public Access {
      if (keysPollMillis < 0) {
        throw new ConfigException("keys-poll-ms must not be negative but was " + keysPollMillis);
      }
      if (!(rateBurstSeconds > 0) || rateBurstSeconds > 3600) {
        throw new ConfigException("rate-burst-seconds must be above 0 and at most 3600 but was " + rateBurstSeconds);
      }
      if (maxStreamsPerKey < 1 || maxStreamsPerKey > 1000) {
        throw new ConfigException("max-streams-per-key must be between 1 and 1000 but was " + maxStreamsPerKey);
      }
    }
  }

  /**
   * Bounds on each request's work, beyond the body sizes: calls in a JSON batch, characters in one
   * string argument, the time one call may take, how long a connection may stay silent, and the
   * size of a request's headers.
   */
  public record Bounds(int maxBatchCalls, int maxArgumentChars, long callDeadlineMillis, long httpIdleTimeoutMillis,
      int maxHeaderBytes) {
    public Bounds {
      if (maxBatchCalls < 1 || maxBatchCalls > 1_000_000) {
        throw new ConfigException("max-batch-calls must be between 1 and 1000000 but was " + maxBatchCalls);
      }
      if (maxArgumentChars < 100 || maxArgumentChars > 10_000_000) {
        throw new ConfigException("max-argument-chars must be between 100 and 10000000 but was " + maxArgumentChars);
      }
      if (callDeadlineMillis < 1 || callDeadlineMillis > 600_000) {
        throw new ConfigException("call-deadline-ms must be between 1 and 600000 but was " + callDeadlineMillis);
      }
      if (httpIdleTimeoutMillis < 100 || httpIdleTimeoutMillis > 3_600_000) {
        throw new ConfigException("http-idle-timeout-ms must be between 100 and 3600000 but was " + httpIdleTimeoutMillis);
      }
      if (maxHeaderBytes < 1024 || maxHeaderBytes > 1 << 20) {
        throw new ConfigException("max-header-bytes must be between 1024 and 1048576 but was " + maxHeaderBytes);
      }
    }
  }


  public ServiceConfig {
    if (port < 0 || port > 65535) {
      throw new ConfigException("port must be between 0 and 65535 but was " + port);
    }
    if (maxBodyBytes < 1024 || maxBodyBytes > 256L * 1024 * 1024) {
      throw new ConfigException("max-body-bytes must be between 1024 and 268435456 but was " + maxBodyBytes);
    }
    if (maxBatchBytes < 1024 || maxBatchBytes > 1024L * 1024 * 1024) {
      throw new ConfigException("max-batch-bytes must be between 1024 and 1073741824 but was " + maxBatchBytes);
    }
    if (cacheSize < 0) {
      throw new ConfigException("cache-size must not be negative but was " + cacheSize);
    }
    if (callThreads < 0 || callThreads > 512) {
      throw new ConfigException("call-threads must be between 0 and 512 but was " + callThreads);
    }
    factsDirs = List.copyOf(factsDirs);
    if (factsPollMillis < 0) {
      throw new ConfigException("facts-poll-ms must not be negative but was " + factsPollMillis);
    }
    if (!ledger.equals("sqlite") && !ledger.equals("postgresql")) {
      throw new ConfigException("ledger must be sqlite or postgresql but was '" + ledger + "'");
    }
    if (ledger.equals("postgresql") && !ledgerUrl.startsWith("jdbc:postgresql://")) {
      throw new ConfigException("ledger-url must be a jdbc:postgresql:// URL when ledger=postgresql but was '" + ledgerUrl + "'");
    }
    if (!durability.equals("commit") && !durability.equals("async")) {
      throw new ConfigException("durability must be commit or async but was '" + durability + "'");
    }
    if (ledgerPoolSize < 1 || ledgerQueue < 1 || retentionDays < 0 || retentionMaxRecords < 0 || retentionMaxBytes < 0) {
      throw new ConfigException("ledger-pool-size and ledger-queue must be positive, retention-days, "
          + "retention-max-records and retention-max-bytes not negative");
    }
    searchDirs = List.copyOf(searchDirs);
    if (searchPollMillis < 0 || searchMemoryChars < 0) {
      throw new ConfigException("search-poll-ms and search-memory-chars must not be negative");
    }
    java.util.Objects.requireNonNull(access, "access");
    java.util.Objects.requireNonNull(bounds, "bounds");
    if (!openAccess && access.keysFile() == null && !isLoopback(host)) {
      throw new ConfigException("refusing to listen on " + host + " without API keys: give a keys-file, use a loopback host "
          + "(127.0.0.1), or set open-access=true to serve every caller who can reach it");
    }
  }

  /**
   * One setting: its name (flag {@code --NAME}, variable {@code RECKONER_NAME}, file key {@code NAME}),
   * its default, whether only {@code serve} takes it (HTTP settings), and what it means. The README's
   * settings table lists the same names and defaults (a test compares them).
   */
  public record Setting(String name, String defaultValue, boolean serveOnly, String meaning) {}

  /** Every setting, in the README's order. */
  public static final List<Setting> SETTINGS = List.of(
      new Setting("host", "127.0.0.1", true, "Address to listen on; without API keys only loopback addresses are accepted."),
      new Setting("port", "8080", true, "TCP port (0: any free port)."),
      new Setting("data-dir", "./data", false, "Directory of the ledger and facts/."),
      new Setting("max-body-bytes", "1048576", true, "Largest request body; larger bodies get 413 payload_too_large."),
      new Setting("open-access", "false", true,
          "Allow a non-loopback host without API keys (for a container behind an authenticating proxy)."),
      new Setting("max-batch-bytes", "16777216", true, "Largest JSON batch, splice or fill body, and longest NDJSON line."),
      new Setting("cache-size", "100000", false, "Answers kept in the answer cache; 0 turns it off."),
      new Setting("call-threads", "0", false, "Threads that run batch and fill calls; 0 means one per core."),
      new Setting("markup-open", "<:", false, "The splice markup: the string that opens a call."),
      new Setting("markup-separator", " :: ", false, "The splice markup: the string between a call and its answer."),
      new Setting("markup-close", ":>", false, "The splice markup: the string that closes a call."),
      new Setting("facts-dirs", "", false, "More directories of fact files, comma-separated (flag --facts-dir, repeatable)."),
      new Setting("facts-demo", "true", false, "Serve the shipped demo fact sets demo and demo-words."),
      new Setting("facts-default-set", "demo", false, "The fact set a call without set reads."),
      new Setting("facts-poll-ms", "2000", false, "How often fact files are checked for changes; 0: only on an admin reload."),
      new Setting("ledger", "sqlite", false, "Where invocations are kept: sqlite (<data dir>/ledger.db) or postgresql."),
      new Setting("ledger-url", "", false, "JDBC URL of the PostgreSQL ledger, e.g. jdbc:postgresql://127.0.0.1:5432/reckoner."),
      new Setting("ledger-user", "", false, "PostgreSQL user (empty: from the URL)."),
      new Setting("ledger-password", "", false, "PostgreSQL password (empty: from the URL)."),
      new Setting("ledger-pool-size", "8", false, "PostgreSQL connections at most."),
      new Setting("ledger-sync", "true", false,
          "SQLite: every group commit is on the disk (fdatasync) before its answers leave; false: no sync, a record survives a crash of the process but not of the machine (README: What survives a crash)."),
      new Setting("durability", "commit", false,
          "commit: an answer leaves after its record is committed; async: at once, 503 when the queue is full."),
      new Setting("ledger-queue", "65536", false, "Records queued for the ledger writer at most."),
      new Setting("retention-days", "0", false, "Delete records older than this many days (0: keep)."),
      new Setting("retention-max-records", "0", false, "Delete the oldest records beyond this count (0: keep)."),
      new Setting("retention-max-bytes", "0", false,
          "Delete the oldest records while the rest take more than this (500MB, 2GiB; 0: keep)."),
      new Setting("search-dirs", "", false,
          "More directories of search collection files, comma-separated (flag --search-dir, repeatable)."),
      new Setting("search-demo", "true", false, "Serve the shipped demo collection demo."),
      new Setting("search-default-collection", "demo", false, "The collection a search call without collection reads."),
      new Setting("search-poll-ms", "2000", false, "How often collection files are checked for changes; 0: only on an admin reload."),
      new Setting("search-index-dir", "", false, "Where on-disk indexes live (none: <data dir>/search-index)."),
      new Setting("search-memory-chars", "16000000", false,
          "Collections of at most this many characters are indexed in memory; larger ones on disk, memory-mapped."),
      new Setting("access-log", "true", true, "Log every HTTP request as one JSON line (logger reckoner.access)."),
      new Setting("keys-file", "", true, "The API keys (JSON Lines; see Access). None: no keys, and loopback only."),
      new Setting("keys-poll-ms", "2000", true, "How often the keys file is checked for changes; 0: read at start only."),
      new Setting("rate-burst-seconds", "1", true, "How many seconds of its rate_per_s a key may spend at once."),
      new Setting("max-streams-per-key", "4", true, "NDJSON batch streams one key may have open at once."),
      new Setting("max-batch-calls", "10000", true, "Calls in one JSON batch at most (stream more as NDJSON)."),
      new Setting("max-argument-chars", "10000", false, "Characters in one string argument at most (longer: 422 limit_exceeded)."),
      new Setting("call-deadline-ms", "1000", false, "Time one call may take; past it the call answers 422 limit_exceeded."),
      new Setting("http-idle-timeout-ms", "30000", true, "A connection silent this long is closed (slow or stalled clients)."),
      new Setting("max-header-bytes", "8192", true, "Largest request line and headers; larger get 431."));

  /** Every setting with its default. */
  public static final Map<String, String> DEFAULTS = defaults();

  private static Map<String, String> defaults() {
    Map<String, String> d = new LinkedHashMap<>();
    SETTINGS.forEach(setting -> d.put(setting.name(), setting.defaultValue()));
    return java.util.Collections.unmodifiableMap(d);
  }

  /** Where on-disk search indexes live: {@code search-index-dir}, or {@code <data dir>/search-index}. */
  public Path searchIndexPath() {
    return searchIndexDir.isEmpty() ? dataDir.resolve("search-index") : Path.of(searchIndexDir);
  }

  /** Builds the config from settings keyed by their names; unknown names and bad values fail, naming the setting. */
  public static ServiceConfig from(Map<String, String> settings) {
    Set<String> unknown = new TreeSet<>(settings.keySet());
    unknown.removeAll(DEFAULTS.keySet());
    if (!unknown.isEmpty()) {
      throw new ConfigException("unknown setting(s) " + unknown + "; known: " + DEFAULTS.keySet());
    }
    Map<String, String> s = new LinkedHashMap<>(DEFAULTS);
    s.putAll(settings);
    return new ServiceConfig(
        s.get("host").trim(),
        integer(s, "port"),
        Path.of(s.get("data-dir")),
        longValue(s, "max-body-bytes"),
        bool(s, "open-access"),
        longValue(s, "max-batch-bytes"),
        longValue(s, "cache-size"),
        integer(s, "call-threads"),
        s.get("markup-open"),
        s.get("markup-separator"),
        s.get("markup-close"),
        paths(s.get("facts-dirs")),
        bool(s, "facts-demo"),
        s.get("facts-default-set").trim(),
        longValue(s, "facts-poll-ms"),
        s.get("ledger").trim(),
        s.get("ledger-url").trim(),
        s.get("ledger-user"),
        s.get("ledger-password"),
        integer(s, "ledger-pool-size"),
        bool(s, "ledger-sync"),
        s.get("durability").trim(),
        integer(s, "ledger-queue"),
        longValue(s, "retention-days"),
        longValue(s, "retention-max-records"),
        byteSize(s, "retention-max-bytes"),
        paths(s.get("search-dirs")),
        bool(s, "search-demo"),
        s.get("search-default-collection").trim(),
        longValue(s, "search-poll-ms"),
        s.get("search-index-dir").trim(),
        longValue(s, "search-memory-chars"),
        bool(s, "access-log"),
        new Access(s.get("keys-file").isBlank() ? null : Path.of(s.get("keys-file").trim()), longValue(s, "keys-poll-ms"),
            decimal(s, "rate-burst-seconds"), integer(s, "max-streams-per-key")),
        new Bounds(integer(s, "max-batch-calls"), integer(s, "max-argument-chars"), longValue(s, "call-deadline-ms"),
            longValue(s, "http-idle-timeout-ms"), integer(s, "max-header-bytes")));
  }

  /**
   * Merges the sources in precedence order: {@code file} (may be null), then the environment's
   * {@code RECKONER_*} variables, then {@code flags}.
   */
  public static Map<String, String> merge(Path file, Map<String, String> env, Map<String, String> flags) {
    Map<String, String> merged = new LinkedHashMap<>();
    if (file != null) {
      merged.putAll(readFile(file));
    }
    for (String name : DEFAULTS.keySet()) {
      String v = env.get(envName(name));
      if (v != null) {
        merged.put(name, v);
      }
    }
    merged.putAll(flags);
    return merged;
  }

  /** {@code data-dir} is read from {@code RECKONER_DATA_DIR}. */
  public static String envName(String setting) {
    return "RECKONER_" + setting.toUpperCase(Locale.ROOT).replace('-', '_');
  }

  private static Map<String, String> readFile(Path file) {
    Properties p = new Properties();
    try (Reader r = Files.newBufferedReader(file, StandardCharsets.UTF_8)) {
      p.load(r);
    } catch (IOException e) {
      throw new ConfigException("cannot read config file " + file + ": " + e.getMessage());
    }
    Map<String, String> m = new LinkedHashMap<>();
    p.stringPropertyNames().forEach(k -> m.put(k.trim(), k.startsWith("markup-") ? p.getProperty(k) : p.getProperty(k).trim()));
    return m;
  }

  /** A comma-separated list of paths; empty entries are ignored. */
  private static List<Path> paths(String value) {
    List<Path> out = new java.util.ArrayList<>();
    for (String part : value.split(",")) {
      if (!part.isBlank()) {
        out.add(Path.of(part.trim()));
      }
    }
    return out;
  }

  private static int integer(Map<String, String> s, String name) {
    try {
      return Integer.parseInt(s.get(name).trim());
    } catch (NumberFormatException e) {
      throw new ConfigException(name + " must be a whole number but was '" + s.get(name) + "'");
    }
  }

  private static double decimal(Map<String, String> s, String name) {
    try {
      double d = Double.parseDouble(s.get(name).trim());
      if (Double.isNaN(d) || Double.isInfinite(d)) {
        throw new NumberFormatException();
      }
      return d;
    } catch (NumberFormatException e) {
      throw new ConfigException(name + " must be a number but was '" + s.get(name) + "'");
    }
  }

  private static long longValue(Map<String, String> s, String name) {
    try {
      return Long.parseLong(s.get(name).trim());
    } catch (NumberFormatException e) {
      throw new ConfigException(name + " must be a whole number but was '" + s.get(name) + "'");
    }
  }

  private static final java.util.regex.Pattern BYTE_SIZE =
      java.util.regex.Pattern.compile("(\\d{1,18})\\s*(?:([kKMGT])(i?)B?|B)?");

  /**
   * A size in bytes: digits, optionally followed by a decimal prefix ({@code kB}, {@code MB},
   * {@code GB}, {@code TB}: powers of 1000) or a binary one ({@code KiB}, {@code MiB}, {@code GiB},
   * {@code TiB}: powers of 1024), as IEC 80000-13 names them; the trailing {@code B} may be left out.
   */
  static long byteSize(Map<String, String> s, String name) {
    String v = s.get(name).trim();
    java.util.regex.Matcher m = BYTE_SIZE.matcher(v);
    if (!m.matches()) {
      throw new ConfigException(name + " must be a number of bytes, such as 500000000, 500MB or 2GiB, but was '" + v + "'");
    }
    long n = Long.parseLong(m.group(1));
    if (m.group(2) == null) {
      return n;
    }
    boolean binary = !m.group(3).isEmpty();
    if (!binary && m.group(2).equals("K")) {
      throw new ConfigException(name + ": write kB for 1000 bytes or KiB for 1024, not '" + v + "'");
    }
    if (binary && m.group(2).equals("k")) {
      throw new ConfigException(name + ": write KiB for 1024 bytes, not '" + v + "'");
    }
    int power = "kMGT".indexOf(m.group(2).equals("K") ? "k" : m.group(2)) + 1;
    long unit = 1;
    for (int i = 0; i < power; i++) {
      unit *= binary ? 1024 : 1000;
    }
    try {
      return Math.multiplyExact(n, unit);
    } catch (ArithmeticException e) {
      throw new ConfigException(name + " is too large: '" + v + "'");
    }
  }

  private static boolean bool(Map<String, String> s, String name) {
    String v = s.get(name).trim().toLowerCase(Locale.ROOT);
    if (!v.equals("true") && !v.equals("false")) {
      throw new ConfigException(name + " must be true or false but was '" + s.get(name) + "'");
    }
    return v.equals("true");
  }

  static boolean isLoopback(String host) {
    if (host.equals("localhost")) {
      return true;
    }
    try {
      // Only literal addresses are checked, so no name lookup happens here.
      if (!host.matches("[0-9.]+|[0-9a-fA-F:]+|\\[[0-9a-fA-F:]+\\]")) {
        return false;
      }
      return InetAddress.getByName(host.replace("[", "").replace("]", "")).isLoopbackAddress();
    } catch (UnknownHostException e) {
      return false;
    }
  }
}
