import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import reckoner.arith.ArithTool;
import reckoner.arith.ArithToolV2;
import reckoner.tool.Arguments;
import reckoner.tool.CallContext;
import reckoner.tool.Tool;
import reckoner.tool.ToolException;

/**
 * The arith benchmark, one source file run by the java launcher against the service jar (see
 * run.sh): the in-process cost of one call (canonicalize + invoke, no HTTP, no cache, no ledger)
 * of arith@2 against arith@1 as the baseline measured in the same run, on the same plain
 * expressions; then arith@2 on phrasings that arith@1 refuses, and on hostile expressions, one
 * by one. Each case runs a warm-up round (not reported), then SAMPLES timed calls (System.nanoTime
 * around each call, its own cost included); the figures are per-call percentiles.
 */
public final class ArithBenchmark {
  private static final int SAMPLES = 20_000;
  private static final int HOSTILE_SAMPLES = 20;
  private static final CallContext CONTEXT = CallContext.systemUtc();

  /** Expressions both versions answer: arith@1's documented form. */
  private static final List<String> PLAIN = List.of("1250/4000", "0.1+0.2", "2+3*4", "(2+3)*4", "2^10", "22/7",
      "1.05^10*1000", "sqrt(2)", "17.5*3-4/7", "2^0.5", "sin(pi/6)", "100*(1+0.04/12)^60", "-2.675", "1e6/3",
      "3.14159*2.5^2", "(45+55)/2");
  /** Phrasings only arith@2 reads. */
  private static final List<String> PHRASES = List.of("What is 25 times 4?", "15% of 80", "80 + 15%", "2**10",
      "square root of 144", "what percent of 80 is 12", "the average of 4, 8 and 15", "$1,250 * 12",
      "round 2/3 to 3 decimal places", "twenty-five plus seventeen", "5!", "log(100)", "sin(30°)", "6 x 7",
      "17 mod 5", "1 1/2 + 2 3/4");
  /** Hostile inputs, each at its limit. */
  private static final List<String> HOSTILE = List.of("9^9^9^9", "(1 + 0.05/365)^(365*30)", "1.0000001^99999",
      "3000!", "10000 choose 5000", "sqrt(" + "9".repeat(990) + ")", "(10^9999) mod (1e-9999)",
      "root(" + "7".repeat(900) + ", 99)", "(1e9999)^(1/3)", "(4/3)^30000 - (4/3)^30000 + 0.005",
      "1+".repeat(333) + "1", "(".repeat(50) + "1/3" + ")".repeat(50), "2^33000 * 3^20000");

  public static void main(String[] args) throws Exception {
    Tool v1 = new ArithTool();
    Tool v2 = new ArithToolV2();
    System.out.printf(Locale.ROOT, "# per call, canonicalize + invoke in process, %d calls per row after a warm-up round%n", SAMPLES);
    for (int round = 0; round < 2; round++) {
      boolean report = round == 1;
      long[] base = measure(v1, PLAIN, SAMPLES);
      long[] plain = measure(v2, PLAIN, SAMPLES);
      long[] phrases = measure(v2, PHRASES, SAMPLES);
      if (report) {
        print("arith@1 plain expressions (baseline)", base, base);
        print("arith@2 the same expressions", plain, base);
        print("arith@2 phrasings arith@1 refuses", phrases, base);
      }
    }
    System.out.println("# hostile inputs, arith@2, " + HOSTILE_SAMPLES + " calls each after a warm-up round:"
        + " wall-clock median and max, and the median of the calling thread's CPU time (unaffected by other load)");
    for (String h : HOSTILE) {
      measure(v2, List.of(h), 3);
      long[] cpu = new long[HOSTILE_SAMPLES];
      long[] t = measure(v2, List.of(h), HOSTILE_SAMPLES, cpu);
      System.out.printf(Locale.ROOT, "  %-44s p50=%9.1f us  max=%9.1f us  cpu p50=%9.1f us  -> %s%n", clip(h, 44),
          t[t.length / 2] / 1e3, t[t.length - 1] / 1e3, cpu[cpu.length / 2] / 1e3, clip(answer(v2, h), 50));
    }
  }

  private static long[] measure(Tool tool, List<String> exprs, int samples) {
    return measure(tool, exprs, samples, null);
  }

  /** Sorted wall-clock times of each call; {@code cpu}, if given, receives the sorted CPU times. */
  private static long[] measure(Tool tool, List<String> exprs, int samples, long[] cpu) {
    ThreadMXBean threads = ManagementFactory.getThreadMXBean();
    long[] t = new long[samples];
    for (int i = 0; i < samples; i++) {
      String e = exprs.get(i % exprs.size());
      long cpuStart = cpu == null ? 0 : threads.getCurrentThreadCpuTime();
      long start = System.nanoTime();
      answer(tool, e);
      t[i] = System.nanoTime() - start;
      if (cpu != null) {
        cpu[i] = threads.getCurrentThreadCpuTime() - cpuStart;
      }
    }
    Arrays.sort(t);
    if (cpu != null) {
      Arrays.sort(cpu);
    }
    return t;
  }

  private static String answer(Tool tool, String e) {
    try {
      return tool.invoke(tool.canonicalize(Arguments.of("text", e)), CONTEXT).text();
    } catch (ToolException ex) {
      return ex.error().text();
    }
  }

  private static void print(String name, long[] t, long[] base) {
    double p50 = t[t.length / 2] / 1e3;
    double p99 = t[(int) (t.length * 0.99)] / 1e3;
    double ratio = (double) t[t.length / 2] / base[base.length / 2];
    System.out.printf(Locale.ROOT, "  %-38s p50=%7.2f us  p99=%8.2f us  p50 ratio to baseline=%5.2f%n", name, p50, p99, ratio);
  }

  private static String clip(String s, int n) {
    return s.length() <= n ? s : s.substring(0, n - 1) + "…";
  }
}
