package reckoner;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.lang.reflect.RecordComponent;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import picocli.CommandLine;
import picocli.CommandLine.Model.CommandSpec;
import reckoner.config.ServiceConfig;

/**
 * README, section "Settings": every setting of the README's table exists with the default it
 * states, and each one takes effect when given as a flag, as an environment variable and as a
 * key of the properties file.
 */
final class SettingsTest {
  private static final Pattern ROW = Pattern.compile("^\\| `([a-z0-9-]+)` \\| (?:`(.*)`|\\(none\\)) \\| .+ \\|$");

  /** A value other than the default for each setting, and companions it needs to be valid. */
  private static final Map<String, String[]> TRIALS = new LinkedHashMap<>();

  static {
    trial("host", "::1");
    trial("port", "18081");
    trial("data-dir", "trial-data");
    trial("max-body-bytes", "2048");
    trial("open-access", "true");
    trial("max-batch-bytes", "4096");
    trial("cache-size", "17");
    trial("call-threads", "3");
    trial("markup-open", "[[q:");
    trial("markup-separator", " ~~ ");
    trial("markup-close", ":q]]");
    trial("facts-dirs", "trial-facts");
    trial("facts-demo", "false", "facts-default-set", "mine");
    trial("facts-default-set", "demo-words");
    trial("facts-poll-ms", "250");
    trial("ledger", "postgresql", "ledger-url", "jdbc:postgresql://127.0.0.1:5999/x");
    trial("ledger-url", "jdbc:postgresql://127.0.0.1:5998/y");
    trial("ledger-user", "trial-user");
    trial("ledger-password", "trial-password");
    trial("ledger-pool-size", "3");
    trial("ledger-sync", "false");
    trial("durability", "async");
    trial("ledger-queue", "99");
    trial("retention-days", "30");
    trial("retention-max-records", "1000000");
    trial("retention-max-bytes", "123456789");
    trial("search-dirs", "trial-collections");
    trial("search-demo", "false", "search-default-collection", "mine");
    trial("search-default-collection", "other");
    trial("search-poll-ms", "750");
    trial("search-index-dir", "trial-index");
    trial("search-memory-chars", "1000");
    trial("access-log", "false");
    trial("keys-file", "trial-keys.jsonl", "host", "0.0.0.0");
    trial("keys-poll-ms", "500");
    trial("rate-burst-seconds", "2.5");
    trial("max-streams-per-key", "9");
    trial("max-batch-calls", "77");
    trial("max-argument-chars", "5000");
    trial("call-deadline-ms", "250");
    trial("http-idle-timeout-ms", "5000");
    trial("max-header-bytes", "16384");
  }

  private static void trial(String name, String value, String... companions) {
    String[] v = new String[1 + companions.length];
    v[0] = value;
    System.arraycopy(companions, 0, v, 1, companions.length);
    TRIALS.put(name, v);
  }

  static List<String[]> readmeRows() throws IOException {
    List<String[]> rows = new ArrayList<>();
    String readme = Files.readString(Path.of(System.getProperty("reckoner.specs.dir"), "..", "README.md"), StandardCharsets.UTF_8);
    String section = readme.substring(readme.indexOf("## Settings"), readme.indexOf("\n## ", readme.indexOf("## Settings") + 3));
    for (String line : section.split("\n")) {
      Matcher m = ROW.matcher(line);
      if (m.matches()) {
        rows.add(new String[] {m.group(1), m.group(2) == null ? "" : m.group(2)});
      }
    }
    return rows;
  }

  @Test
  void readmeTable_listsEverySetting_withItsDefault() throws IOException {
    Map<String, String> readme = new LinkedHashMap<>();
    readmeRows().forEach(r -> readme.put(r[0], r[1]));
    assertEquals(ServiceConfig.DEFAULTS, readme);
  }

  @Test
  void everySetting_hasATrial() {
    assertEquals(ServiceConfig.DEFAULTS.keySet(), TRIALS.keySet(), "add a trial value for each new setting");
  }

  static List<String> settingNames() throws IOException {
    return readmeRows().stream().map(r -> r[0]).toList();
  }

  @ParameterizedTest(name = "--{0}")
  @MethodSource("settingNames")
  void asFlag_takesEffect(String name) {
    String[] trial = TRIALS.get(name);
    List<String> args = new ArrayList<>(List.of("serve"));
    for (int i = 0; i < trial.length; i += 2) {
      String setting = i == 0 ? name : trial[i - 1];
      String value = trial[i];
      args.add(flagOf(setting) + "=" + value);
    }
    ServiceConfig config = parse(args, Map.of(), null);
    assertSetting(config, name, trial[0]);
  }

  @ParameterizedTest(name = "RECKONER_* for {0}")
  @MethodSource("settingNames")
  void asEnvironmentVariable_takesEffect(String name) {
    String[] trial = TRIALS.get(name);
    Map<String, String> env = new LinkedHashMap<>();
    env.put(ServiceConfig.envName(name), trial[0]);
    for (int i = 1; i < trial.length; i += 2) {
      env.put(ServiceConfig.envName(trial[i]), trial[i + 1]);
    }
    assertSetting(parse(List.of("serve"), env, null), name, trial[0]);
  }

  @ParameterizedTest(name = "file key {0}")
  @MethodSource("settingNames")
  void asFileKey_takesEffect(String name, @TempDir Path dir) throws IOException {
    String[] trial = TRIALS.get(name);
    StringBuilder file = new StringBuilder(name + "=" + escape(trial[0]) + "\n");
    for (int i = 1; i < trial.length; i += 2) {
      file.append(trial[i]).append('=').append(escape(trial[i + 1])).append('\n');
    }
    Path config = dir.resolve("reckoner.properties");
    Files.writeString(config, file.toString(), StandardCharsets.ISO_8859_1);
    assertSetting(parse(List.of("serve", "--config=" + config), Map.of(), null), name, trial[0]);
    assertSetting(parse(List.of("serve"), Map.of("RECKONER_CONFIG", config.toString()), null), name, trial[0]);
  }

  @Test
  void precedence_flagOverEnvironmentOverFileOverDefault(@TempDir Path dir) throws IOException {
    Path config = dir.resolve("reckoner.properties");
    Files.writeString(config, "cache-size=1\ncall-threads=1\nfacts-poll-ms=1\n");
    ServiceConfig c = parse(List.of("serve", "--config=" + config, "--cache-size=3"),
        Map.of("RECKONER_CACHE_SIZE", "2", "RECKONER_CALL_THREADS", "2"), null);
    assertEquals(3, c.cacheSize());
    assertEquals(2, c.callThreads());
    assertEquals(1, c.factsPollMillis());
    assertEquals(8, c.ledgerPoolSize());
  }

  @Test
  void fill_takesEveryNonHttpSetting_andNoHttpOne() {
    CommandLine line = Main.commandLine();
    CommandSpec fill = line.getSubcommands().get("fill").getCommandSpec();
    for (ServiceConfig.Setting s : ServiceConfig.SETTINGS) {
      assertEquals(!s.serveOnly(), fill.findOption(SettingFlags.flag(s)) != null, s.name());
    }
  }

  @Test
  void booleanFlags_standAloneOrNegated() {
    assertTrue(parse(List.of("serve", "--open-access", "--host=0.0.0.0"), Map.of(), null).openAccess());
    assertEquals(false, parse(List.of("serve", "--no-facts-demo", "--facts-default-set=x"), Map.of(), null).factsDemo());
  }

  @Test
  void listFlag_repeats() {
    ServiceConfig c = parse(List.of("serve", "--facts-dir=a", "--facts-dir=b"), Map.of(), null);
    assertEquals(List.of(Path.of("a"), Path.of("b")), c.factsDirs());
  }

  private static String flagOf(String setting) {
    return ServiceConfig.SETTINGS.stream().filter(s -> s.name().equals(setting)).map(SettingFlags::flag).findFirst().orElseThrow();
  }

  private static String escape(String value) {
    return value.replace("\\", "\\\\").replace(" ", "\\ ").replace(":", "\\:");
  }

  /** Parses a command line as Main does and resolves its settings, without starting anything. */
  private static ServiceConfig parse(List<String> args, Map<String, String> env, Path configFile) {
    CommandLine line = Main.commandLine();
    CommandLine.ParseResult result = line.parseArgs(args.toArray(String[]::new));
    CommandLine serve = result.subcommand().commandSpec().commandLine();
    CommandSpec spec = serve.getCommandSpec();
    Path file = configFile;
    if (result.subcommand().hasMatchedOption("--config")) {
      file = result.subcommand().matchedOptionValue("--config", null);
    }
    return SettingFlags.resolve(spec, file, env);
  }

  /** The config's value for a setting, read from the record component of the same name, as text. */
  private static void assertSetting(ServiceConfig config, String name, String expected) {
    Object[] value = new Object[1];
    assertTrue(find(config, toCamel(name), value), "no config component for setting " + name);
    Object actual = value[0];
    String text = actual instanceof List<?> list ? String.join(",", list.stream().map(Object::toString).toList())
        : String.valueOf(actual);
    assertEquals(expected, text, name);
  }

  /** Finds the component named {@code component} in {@code record} or in a record nested in it. */
  private static boolean find(Record record, String component, Object[] value) {
    for (RecordComponent rc : record.getClass().getRecordComponents()) {
      Object v;
      try {
        v = rc.getAccessor().invoke(record);
      } catch (ReflectiveOperationException e) {
        throw new AssertionError(e);
      }
      if (rc.getName().equals(component) || rc.getName().equals(component.replace("Ms", "Millis"))) {
        value[0] = v;
        return true;
      }
      if (v instanceof Record nested && find(nested, component, value)) {
        return true;
      }
    }
    return false;
  }

  private static String toCamel(String name) {
    StringBuilder sb = new StringBuilder();
    boolean up = false;
    for (char c : name.toCharArray()) {
      if (c == '-') {
        up = true;
      } else {
        sb.append(up ? Character.toUpperCase(c) : c);
        up = false;
      }
    }
    return sb.toString();
  }
}
