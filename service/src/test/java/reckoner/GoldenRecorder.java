package reckoner;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.OptionalInt;
import java.util.Random;
import java.util.Set;
import java.util.stream.Stream;
import reckoner.call.CallRequest;
import reckoner.call.Invoker;
import reckoner.call.Outcome;
import reckoner.spec.Json;
import reckoner.spec.SpecLoader;
import reckoner.spec.ToolCatalog;
import reckoner.tool.ToolRegistry;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.databind.node.ObjectNode;

/**
 * Wrote {@code golden/v1.jsonl} once, from the build that published version 1 of every tool: every
 * call of the determinism corpus, every worked example of the version 1 specs, and several
 * thousand calls generated from a fixed seed over each tool's grammar (the unit table's every
 * unit, the demo fact keys and near misses, date operations over edge dates, random expressions),
 * each with the answer text, outcome and data version that build gave. {@link GoldenV1Test}
 * replays the file on every build: version 1 never changes an answer.
 *
 * <p>Run only to add calls, never to change a recorded answer: {@code java -cp ... reckoner.GoldenRecorder
 * tool-specs service/src/test/resources/golden/v1.jsonl}. It refuses to overwrite an existing file.
 */
public final class GoldenRecorder {
  private GoldenRecorder() {}

  public static void main(String[] args) throws Exception {
    Path specs = Path.of(args[0]);
    Path out = Path.of(args[1]);
    if (Files.exists(out)) {
      throw new IllegalStateException(out + " exists: the golden answers are frozen; delete it only to re-record on the publishing build");
    }
    JsonMapper json = Json.newMapper();
    Invoker invoker = new Invoker(ToolCatalog.of(ToolRegistry.of(Tools.demo()), new SpecLoader(json)), CorpusRunner.CLOCK);
    Set<String> calls = new LinkedHashSet<>(); // canonical JSON lines of {"tool","version","args","as_of_header"?}
    corpus(json, calls);
    examples(json, specs, calls);
    generated(json, calls);
    Files.createDirectories(out.getParent());
    try (Writer w = Files.newBufferedWriter(out, StandardCharsets.UTF_8)) {
      for (String line : calls) {
        ObjectNode call = (ObjectNode) json.readTree(line);
        JsonNode header = call.get("as_of_header");
        Outcome o = invoker.invoke(new CallRequest(call.get("tool").asString(), OptionalInt.of(call.get("version").asInt()),
            call.get("args"), header == null ? null : header.asString(), null, null));
        call.put("text", o.text());
        call.put("outcome", o.error().map(e -> e.code().wireName()).orElse("ok"));
        o.answer().flatMap(a -> a.dataVersion()).ifPresent(v -> call.put("data_version", v));
        w.write(json.writeValueAsString(call));
        w.write('\n');
      }
    }
    System.out.println(calls.size() + " calls recorded in " + out);
  }

  private static void corpus(JsonMapper json, Set<String> calls) throws Exception {
    Path dir = Path.of(GoldenRecorder.class.getClassLoader().getResource("corpus").toURI());
    List<Path> files;
    try (Stream<Path> s = Files.list(dir)) {
      files = s.filter(p -> p.toString().endsWith(".jsonl")).sorted().toList();
    }
    for (Path file : files) {
      for (String line : Files.readAllLines(file, StandardCharsets.UTF_8)) {
        if (!line.isBlank()) {
          ObjectNode call = (ObjectNode) json.readTree(line);
          if (call.get("version").asInt() == 1) {
            calls.add(json.writeValueAsString(call));
          }
        }
      }
    }
  }

  private static void examples(JsonMapper json, Path specs, Set<String> calls) throws IOException {
    for (String tool : List.of("arith", "dates", "units", "facts")) {
      JsonNode spec = json.readTree(specs.resolve(tool).resolve("1.json").toFile());
      for (JsonNode example : spec.get("x-reckoner").get("examples")) {
        calls.add(call(json, tool, example.get("args"), null));
      }
    }
  }

  private static String call(JsonMapper json, String tool, JsonNode args, String asOfHeader) {
    ObjectNode call = json.createObjectNode();
    call.put("tool", tool);
    call.put("version", 1);
    call.set("args", args);
    if (asOfHeader != null) {
      call.put("as_of_header", asOfHeader);
    }
    return json.writeValueAsString(call);
  }

  private static void generated(JsonMapper json, Set<String> calls) throws IOException {
    Random random = new Random(20261205L);
    arith(json, random, calls);
    units(json, random, calls);
    dates(json, random, calls);
    facts(json, random, calls);
  }

  // ---- arith: random expressions over the grammar, every rounding mode, places and digits ----

  private static final String[] ROUNDINGS = {"half_even", "half_up", "half_down", "up", "down", "ceiling", "floor"};
  private static final String[] FUNCTIONS = {"sqrt", "cbrt", "abs", "exp", "ln", "log", "log10", "log2", "sin", "cos", "tan",
      "asin", "acos", "atan", "floor", "ceil"};

  private static void arith(JsonMapper json, Random random, Set<String> calls) {
    String[] fixed = {"1/3", "2/3", "-2^2", "2^3^2", "0.1+0.2", "1e400*1e400", "1/0", "sqrt(-1)", "ln(0)", "2.675", "-0.001",
        "10%3", "-10%3", "1e-7", "1e21", "123456789012345678901234567890", "2^-1074", "(1", "1)", "1,250", "", " ", "2pi",
        "2(3+4)", "3×4÷2−1", "π", "e^1", "asin(2)", "0^0", "0^-1", "10^100000", "10^100001", "1.5e3", "1.5E3", ".5", "5.",
        "--1", "+1", "1++1", "sqrt 4", "log(100)", "log10(100)", "sin(pi)", "cos(0)", "tan(pi/4)", "floor(-2.5)", "ceil(-2.5)",
        "abs(-3)", "exp(1)", "cbrt(27)", "log2(1024)", "2^0.5", "(-8)^(1/3)", "9999999999999999999999999999999999.5",
        "1/7*7", "22/7", "355/113", "1 + (-1e-383)", "100*1.1", "0.07*100", "19.99*3", "1250/4000*100"};
    for (String e : fixed) {
      calls.add(call(json, "arith", json.createObjectNode().put("expr", e), null));
      calls.add(call(json, "arith", json.createObjectNode().put("text", e), null));
    }
    for (int i = 0; i < 1200; i++) {
      ObjectNode args = json.createObjectNode();
      args.put(random.nextInt(4) == 0 ? "text" : "expr", expression(random, 0));
      switch (random.nextInt(4)) {
        case 0 -> args.put("places", random.nextInt(13) - 2);
        case 1 -> args.put("digits", 1 + random.nextInt(34));
        default -> { }
      }
      if (random.nextInt(3) == 0) {
        args.put("rounding", ROUNDINGS[random.nextInt(ROUNDINGS.length)]);
      }
      if (random.nextInt(8) == 0) {
        args.put("pad_zeros", true);
      }
      calls.add(call(json, "arith", args, null));
    }
  }

  private static String expression(Random random, int depth) {
    int kind = depth > 3 ? 0 : random.nextInt(7);
    switch (kind) {
      case 0, 1:
        return number(random);
      case 2:
        return "(" + expression(random, depth + 1) + ")";
      case 3:
        return FUNCTIONS[random.nextInt(FUNCTIONS.length)] + "(" + expression(random, depth + 1) + ")";
      case 4:
        return "-" + expression(random, depth + 1);
      default:
        String op = String.valueOf("+-*/^%".charAt(random.nextInt(6)));
        String right = op.equals("^") ? Integer.toString(random.nextInt(9) - 3) : expression(random, depth + 1);
        return expression(random, depth + 1) + op + right;
    }
  }

  private static String number(Random random) {
    switch (random.nextInt(6)) {
      case 0:
        return Integer.toString(random.nextInt(10));
      case 1:
        return Integer.toString(random.nextInt(100000));
      case 2:
        return random.nextInt(1000) + "." + String.format(Locale.ROOT, "%03d", random.nextInt(1000));
      case 3:
        return "0." + String.format(Locale.ROOT, "%05d", random.nextInt(100000));
      case 4:
        return (1 + random.nextInt(9)) + "e" + (random.nextInt(41) - 20);
      default:
        return random.nextBoolean() ? "pi" : "e";
    }
  }

  // ---- units: every unit of the table to a unit of its dimension and to a stranger, near misses ----

  private static void units(JsonMapper json, Random random, Set<String> calls) throws IOException {
    List<String[]> rows = new ArrayList<>();
    try (InputStream in = GoldenRecorder.class.getResourceAsStream("/units/units-1.tsv");
        BufferedReader r = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8))) {
      for (String line; (line = r.readLine()) != null; ) {
        if (!line.startsWith("#") && !line.isBlank()) {
          rows.add(line.split("\t"));
        }
      }
    }
    String[] values = {"1", "3.5", "-40", "0", "1e6", "0.001", "100", "98.6", "2.54"};
    for (String[] row : rows) {
      String symbol = row[1].split(" ")[0];
      String name = row[2].split(";")[0].split("/")[0].trim();
      String dimension = row[3];
      List<String[]> same = rows.stream().filter(x -> x[3].equals(dimension)).toList();
      String[] other = same.get(random.nextInt(same.size()));
      String[] stranger = rows.get(random.nextInt(rows.size()));
      String value = values[random.nextInt(values.length)];
      String target = other[1].split(" ")[0];
      calls.add(call(json, "units", json.createObjectNode().put("text", value + " " + symbol + " to " + target), null));
      calls.add(call(json, "units", json.createObjectNode().put("value", value).put("from", name).put("to", target), null));
      calls.add(call(json, "units", json.createObjectNode().put("text", value + " " + name + " in " + stranger[1].split(" ")[0]), null));
      ObjectNode rounded = json.createObjectNode().put("value", value).put("from", symbol).put("to", target);
      if (random.nextBoolean()) {
        rounded.put("digits", 1 + random.nextInt(15));
      } else {
        rounded.put("places", random.nextInt(8));
      }
      rounded.put("rounding", ROUNDINGS[random.nextInt(ROUNDINGS.length)]);
      calls.add(call(json, "units", rounded, null));
      if (name.length() > 3) { // a near miss, for the suggestions
        int at = 1 + random.nextInt(name.length() - 2);
        String typo = name.substring(0, at) + name.substring(at + 1);
        calls.add(call(json, "units", json.createObjectNode().put("text", "2 " + typo + " to " + target), null));
      }
    }
    String[] compounds = {"km/h to m/s", "m/s^2 to ft/s^2", "kg*m^2/s^2 to J", "N·m to ft*lbf", "kWh to MJ", "L/100km to mpg",
        "mpg to L/100km", "°C to °F", "°F to K", "°C/min to K/s", "m² to ft²", "km³ to L", "W/m^2 to BTU/(h*ft^2)", "g/cm^3 to kg/m^3",
        "psi to kPa", "atm to Pa", "mmHg to kPa", "cal to J", "eV to J", "ly to km", "au to km", "kn to km/h", "MiB to MB",
        "GiB to bit", "ton to kg", "oz to g", "floz to mL", "gal to L", "cup to mL", "1,250 m to km", "m to", "to km", "5 km",
        "5 km to kg", "5 furlongs to m", "5 KM to mi", "5 Kg to lb", "-5 K to °C"};
    for (String c : compounds) {
      calls.add(call(json, "units", json.createObjectNode().put("text", (c.matches("^[-0-9].*") ? "" : "12.5 ") + c), null));
    }
  }

  // ---- dates: operations over edge dates, zones, calendars, locales ----

  private static void dates(JsonMapper json, Random random, Set<String> calls) {
    String[] days = {"2024-02-29", "2023-02-28", "2024-01-31", "2000-03-01", "1900-02-28", "2100-12-31", "1970-01-01",
        "2024-03-10", "2024-11-03", "0001-01-01", "-0044-03-15", "9999-12-31", "2023-02-30", "2024-13-01", "2019-06-14",
        "2020-12-31", "2021-01-04", "2026-12-05"};
    String[] durations = {"P1M", "P1Y", "P1D", "P2W", "P1Y2M10DT2H30M", "-P1M", "P0D", "PT36H", "P1000000Y", "P", "1M", "P1.5D"};
    String[] units = {"days", "weeks", "months", "years", "business_days"};
    String[] zones = {"UTC", "America/New_York", "Europe/London", "Asia/Kolkata", "Australia/Lord_Howe", "Pacific/Kiritimati",
        "America/St_Johns", "Nowhere/City", "EST", "+05:30"};
    String[] calendars = {"gregory", "iso8601", "hebrew", "islamic-umalqura", "islamic-civil", "persian", "buddhist", "japanese",
        "chinese", "coptic", "ethiopic", "indian", "mayan"};
    String[] locales = {"en-US", "fr-FR", "de-DE", "ja-JP", "ar-EG", "tr-TR", "hi-IN", "zz-ZZ", "not a tag"};
    for (String d : days) {
      for (String op : List.of("weekday", "iso_week", "day_of_year", "quarter")) {
        calls.add(call(json, "dates", json.createObjectNode().put("op", op).put("date", d), null));
      }
      calls.add(call(json, "dates", json.createObjectNode().put("op", "weekday").put("date", d)
          .put("locale", locales[random.nextInt(locales.length)]).put("style", "long"), null));
      calls.add(call(json, "dates", json.createObjectNode().put("op", "leap_year").put("date", d.substring(0, d.lastIndexOf('-') - 3)), null));
      calls.add(call(json, "dates", json.createObjectNode().put("op", "days_in_month").put("date", d.substring(0, d.lastIndexOf('-'))), null));
      for (String p : durations) {
        calls.add(call(json, "dates", json.createObjectNode().put("text", d + " + " + p), null));
        calls.add(call(json, "dates", json.createObjectNode().put("op", "subtract").put("date", d).put("duration", p), null));
      }
      String to = days[random.nextInt(days.length)];
      for (String u : units) {
        calls.add(call(json, "dates", json.createObjectNode().put("op", "between").put("date", d).put("to", to).put("unit", u), null));
      }
      calls.add(call(json, "dates", json.createObjectNode().put("text", "business days from " + d + " to " + to), null));
      for (String c : calendars) {
        calls.add(call(json, "dates", json.createObjectNode().put("op", "to_calendar").put("date", d).put("calendar", c), null));
        calls.add(call(json, "dates", json.createObjectNode().put("text", d + " in " + c), null));
      }
      String zone = zones[random.nextInt(zones.length)];
      calls.add(call(json, "dates", json.createObjectNode().put("op", "convert_zone").put("date", d + "T02:30").put("zone", zone)
          .put("to", zones[random.nextInt(zones.length)]), null));
      calls.add(call(json, "dates", json.createObjectNode().put("text", d + "T02:30 " + zone + " to UTC"), null));
      calls.add(call(json, "dates", json.createObjectNode().put("text", "today").put("as_of", d), null));
      calls.add(call(json, "dates", json.createObjectNode().put("text", "45 days ago").put("as_of", d), null));
      calls.add(call(json, "dates", json.createObjectNode().put("text", "3 months ago"), d));
      calls.add(call(json, "dates", json.createObjectNode().put("op", "today").put("as_of", d + "T23:30Z").put("zone", zone)
          .put("locale", locales[random.nextInt(locales.length)]).put("style", random.nextBoolean() ? "long" : "iso"), null));
    }
    String[] phrases = {"yesterday", "tomorrow", "next friday", "in 3 days", "1 week ago", "2 years ago", "0 days ago",
        "weekday of 2024-03-01", "leap year 2100", "days in month 2024-02", "quarter 2024-08-15", "iso week 2021-01-03",
        "day of year 2024-12-31", "days from 2024-01-01 to 2024-12-25", "weeks from 2024-01-01 to 2024-12-25",
        "months from 2024-01-31 to 2024-02-29", "years from 2000-02-29 to 2024-02-28", "2024-01-31 - P1M",
        "2024-03-09T12:00 America/New_York + P1D", "2024-03-10T02:30 America/New_York to UTC", "TODAY", "Today ",
        "  45   days   ago  ", "45 day ago", "45 days", "days from 2024-01-01", "2024-10-03 in hebrew", "2024-10-03 in klingon"};
    for (String p : phrases) {
      calls.add(call(json, "dates", json.createObjectNode().put("text", p).put("as_of", "2024-06-12"), null));
    }
  }

  // ---- facts: every key and alias of the demo sets, in several spellings, and near misses ----

  private static void facts(JsonMapper json, Random random, Set<String> calls) throws IOException {
    String[] asOfs = {"1950-01-01", "2000-06-01", "2029-05-31", "2029-06-01", "2033-06-01", "2040-01-01"};
    for (String file : List.of("/demo-facts/tarrowin.jsonl", "/demo-facts/tarrowin-words.jsonl")) {
      try (InputStream in = GoldenRecorder.class.getResourceAsStream(file);
          BufferedReader r = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8))) {
        for (String line; (line = r.readLine()) != null; ) {
          JsonNode fact = json.readTree(line);
          if (fact.get("key") == null) {
            continue;
          }
          String set = fact.get("set").asString();
          List<String> keys = new ArrayList<>();
          keys.add(fact.get("key").asString());
          if (fact.has("aliases")) {
            fact.get("aliases").forEach(a -> keys.add(a.asString()));
          }
          for (String key : keys) {
            calls.add(call(json, "facts", json.createObjectNode().put("key", key).put("set", set), null));
            calls.add(call(json, "facts", json.createObjectNode().put("text", "  " + key.toUpperCase(Locale.ROOT) + " ")
                .put("set", set).put("as_of", asOfs[random.nextInt(asOfs.length)]), null));
            if (key.length() > 3) {
              int at = 1 + random.nextInt(key.length() - 2);
              calls.add(call(json, "facts", json.createObjectNode().put("key", key.substring(0, at) + key.substring(at + 1))
                  .put("set", set), null));
            }
          }
        }
      }
    }
    for (String key : List.of("", "  ", "no such key at all", "ﬁle", "İstanbul", "capital", "CAPITAL")) {
      calls.add(call(json, "facts", json.createObjectNode().put("key", key), null));
    }
    calls.add(call(json, "facts", json.createObjectNode().put("key", "capital").put("set", "no-such-set"), null));
  }
}
