import java.math.BigDecimal;
import java.time.Clock;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import reckoner.tool.Arguments;
import reckoner.tool.CallContext;
import reckoner.tool.Tool;
import reckoner.tool.ToolException;
import reckoner.units.UnitsTool;
import reckoner.units.UnitsToolV2;

/**
 * The units@1 / units@2 latency benchmark, one source file run by the java launcher against the
 * service jar (see run.sh). Each case is one call, canonicalize + invoke on the tool itself (no
 * HTTP, no answer cache), with a value that changes from call to call so that no two canonical
 * argument sets repeat. Every call is timed alone with System.nanoTime (its own cost included).
 * The cases run interleaved, round after round, so that a slow spell of the machine falls on all
 * of them alike; a first round warms the JIT up and is not reported. Units@1 on the same phrase is
 * the baseline; the ratio is units@2's median over units@1's.
 */
public final class UnitsBenchmark {
  private static final int ROUNDS = 6;
  private static final int CALLS = 20_000;

  private record Case(String name, Tool tool, String template, Map<String, Object> extra) {}

  public static void main(String[] args) throws Exception {
    Tool v1 = new UnitsTool();
    Tool v2 = new UnitsToolV2();
    List<Case> cases = new ArrayList<>();
    for (String phrase : List.of("%s km to mi", "%s L/100km to mpg_imp", "%s kg·m²/s² to kWh")) {
      cases.add(new Case("units@1 text  " + phrase, v1, phrase, Map.of()));
      cases.add(new Case("units@2 text  " + phrase, v2, phrase, Map.of()));
    }
    cases.add(new Case("units@1 value km to mi", v1, null, Map.of("from", "km", "to", "mi")));
    cases.add(new Case("units@2 value km to mi", v2, null, Map.of("from", "km", "to", "mi")));
    for (String phrase : List.of("%s cups to ml", "%s ft 11 in to cm", "%s cm to ft+in", "how many feet in %s miles",
        "%s 1/2 cups to ml", "%s F to C", "%s KM to miles", "what is %s kg -> lb?", "%s ton to kg")) {
      cases.add(new Case("units@2 text  " + phrase, v2, phrase, Map.of()));
    }
    CallContext context = new CallContext(Clock.systemUTC());
    Map<String, long[]> samples = new LinkedHashMap<>();
    for (int round = 0; round <= ROUNDS; round++) {
      for (Case c : cases) {
        long[] times = new long[CALLS];
        for (int i = 0; i < CALLS; i++) {
          String value = (1 + (i * 7919L + round * 104729L) % 5000) + "";
          Arguments a = c.template != null
              ? Arguments.of("text", String.format(Locale.ROOT, c.template, value))
              : Arguments.of(c.extra).with("value", new BigDecimal(value));
          long t0 = System.nanoTime();
          try {
            c.tool.invoke(c.tool.canonicalize(a), context);
          } catch (ToolException e) {
            // refusals are timed too
          }
          times[i] = System.nanoTime() - t0;
        }
        if (round > 0) {
          long[] all = samples.computeIfAbsent(c.name, k -> new long[0]);
          long[] joined = Arrays.copyOf(all, all.length + CALLS);
          System.arraycopy(times, 0, joined, all.length, CALLS);
          samples.put(c.name, joined);
        }
      }
    }
    System.out.printf(Locale.ROOT, "java %s, %d cores; %d calls a case (%d rounds after a warm-up round)%n",
        System.getProperty("java.version"), Runtime.getRuntime().availableProcessors(), ROUNDS * CALLS, ROUNDS);
    Map<String, Double> medians = new LinkedHashMap<>();
    for (Map.Entry<String, long[]> e : samples.entrySet()) {
      long[] t = e.getValue();
      Arrays.sort(t);
      double p50 = t[t.length / 2] / 1000.0;
      medians.put(e.getKey(), p50);
      String baseline = e.getKey().replace("units@2", "units@1");
      String ratio = e.getKey().startsWith("units@2") && medians.containsKey(baseline)
          ? String.format(Locale.ROOT, "  x%.2f of units@1", p50 / medians.get(baseline)) : "";
      System.out.printf(Locale.ROOT, "%-42s p50 %7.2f us  p90 %7.2f us  p99 %7.2f us%s%n", e.getKey(), p50,
          t[(int) (t.length * 0.9)] / 1000.0, t[(int) (t.length * 0.99)] / 1000.0, ratio);
    }
  }
}
