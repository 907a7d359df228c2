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
 * @param accessLog whether every HTTP request is logged as one line (logger {@code reckoner.access})
 */
public record ServiceConfig(String host, int port, Path dataDir, long maxBodyBytes, boolean openAccess,
    long maxBatchBytes, long cacheSize, int callThreads, String markupOpen, String markupSeparator, String markupClose,
    List<Path> factsDirs, boolean factsDemo, String factsDefaultSet, long factsPollMillis,
    String ledger, String ledgerUrl, String ledgerUser, String ledgerPassword, int ledgerPoolSize, boolean ledgerSync,
    String durability, int ledgerQueue, long retentionDays, long retentionMaxRecords,
    long retentionMaxBytes, boolean accessLog) {
  /** Every setting with its default. The README's settings table lists the same. */
  public static final Map<String, String> DEFAULTS = defaults();

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
    if (!openAccess && !isLoopback(host)) {
      throw new ConfigException("refusing to listen on " + host + " without API keys: use a loopback host "
          + "(127.0.0.1), or set open-access=true to serve every caller who can reach it");
    }
  }

  private static Map<String, String> defaults() {
    Map<String, String> d = new LinkedHashMap<>();
    d.put("host", "127.0.0.1");
    d.put("port", "8080");
    d.put("data-dir", "./data");
    d.put("max-body-bytes", "1048576");
    d.put("open-access", "false");
    d.put("max-batch-bytes", "16777216");
    d.put("cache-size", "100000");
    d.put("call-threads", "0");
    d.put("markup-open", "<<");
    d.put("markup-separator", " => ");
    d.put("markup-close", ">>");
    d.put("facts-dirs", "");
    d.put("facts-demo", "true");
    d.put("facts-default-set", "demo");
    d.put("facts-poll-ms", "2000");
    d.put("ledger", "sqlite");
    d.put("ledger-url", "");
    d.put("ledger-user", "");
    d.put("ledger-password", "");
    d.put("ledger-pool-size", "8");
    d.put("ledger-sync", "true");
    d.put("durability", "commit");
    d.put("ledger-queue", "65536");
    d.put("retention-days", "0");
    d.put("retention-max-records", "0");
    d.put("retention-max-bytes", "0");
    d.put("access-log", "true");
    return java.util.Collections.unmodifiableMap(d);
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
        bool(s, "access-log"));
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
