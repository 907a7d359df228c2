import java.time.Clock;
import java.time.Instant;
import java.time.ZoneOffset;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import reckoner.Tools;
import reckoner.tool.Arguments;
import reckoner.tool.CallContext;
import reckoner.tool.Tool;

/**
 * The cost of one dates call in process: canonicalize (the text form read) and invoke, per call,
 * for dates@2's phrasings against dates@1's own text form {@code 2024-01-31 + P1M} as the baseline
 * measured in the same run (the machine's speed swings; the ratio is the figure to read). One
 * source file run by the java launcher against the service jar (see run.sh). A first round warms
 * the JIT up and is not reported; then each case runs ROUNDS times over SAMPLES calls and the median
 * of the per-round means is given, in microseconds per call.
 */
public final class DatesBenchmark {
  private static final int SAMPLES = 20_000;
  private static final int ROUNDS = 7;

  public static void main(String[] args) throws Exception {
    Map<Integer, Tool> dates = Map.of(1, find(1), 2, find(2));
    CallContext context = new CallContext(Clock.fixed(Instant.parse("2024-06-12T09:30:00Z"), ZoneOffset.UTC));
    List<Object[]> cases = List.of(
        new Object[] {1, "2024-01-31 + P1M", "baseline: dates@1 text form"},
        new Object[] {2, "2024-01-31 + P1M", "the same text, dates@2"},
        new Object[] {2, "yesterday", "relative day"},
        new Object[] {2, "in 3 days", "relative amount"},
        new Object[] {2, "next Friday", "relative weekday"},
        new Object[] {2, "how many days until Christmas?", "until, courtesy words"},
        new Object[] {2, "end of next month", "period edge"},
        new Object[] {2, "first Monday of September 2024", "nth weekday"},
        new Object[] {2, "90 days after March 1, 2024", "English date arithmetic"},
        new Object[] {2, "5 business days after 2024-03-01", "business days, no region"},
        new Object[] {2, "3 business days after December 23, 2024 in GB-ENG", "business days, holidays (kept sets)"},
        new Object[] {2, "is 2024-07-04 a business day in US", "business day question"},
        new Object[] {2, "2024-03-10 09:00 New York to Tokyo", "zones by city"},
        new Object[] {2, "when pigs fly", "refused: nearest phrase"});
    for (int warm = 0; warm < 2; warm++) {
      for (Object[] c : cases) {
        measure(dates.get((Integer) c[0]), (String) c[1], context);
      }
    }
    System.out.printf(Locale.ROOT, "# %s, %d cores, %s%n", Instant.now(), Runtime.getRuntime().availableProcessors(),
        System.getProperty("java.vm.version"));
    double baseline = 0;
    for (Object[] c : cases) {
      double us = measure(dates.get((Integer) c[0]), (String) c[1], context);
      if (baseline == 0) {
        baseline = us;
      }
      System.out.printf(Locale.ROOT, "dates@%d %-52s %7.2f us/call  %5.2f x baseline  (%s)%n", c[0], "'" + c[1] + "'", us, us / baseline, c[2]);
    }
  }

  private static Tool find(int version) {
    return Tools.demo().stream().filter(t -> t.id().name().equals("dates") && t.id().version() == version).findFirst().orElseThrow();
  }

  /** Median over rounds of the mean time of one canonicalize + invoke, in microseconds. */
  private static double measure(Tool tool, String text, CallContext context) {
    Arguments args = Arguments.of(Map.of("text", text, "as_of", "2024-06-12"));
    double[] means = new double[ROUNDS];
    long sink = 0;
    for (int r = 0; r < ROUNDS; r++) {
      long start = System.nanoTime();
      for (int i = 0; i < SAMPLES; i++) {
        try {
          sink += tool.invoke(tool.canonicalize(args), context).text().length();
        } catch (Exception e) {
          sink += e.getMessage().length();
        }
      }
      means[r] = (System.nanoTime() - start) / 1000.0 / SAMPLES;
    }
    if (sink == 42) {
      System.out.print("");
    }
    Arrays.sort(means);
    return means[ROUNDS / 2];
  }
}
