package reckoner.bench;

import java.time.Clock;
import java.time.Instant;
import java.time.ZoneOffset;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;
import reckoner.Tools;
import reckoner.call.AnswerCache;
import reckoner.call.CallRequest;
import reckoner.call.Invoker;
import reckoner.call.Outcome;
import reckoner.spec.Json;
import reckoner.spec.SpecLoader;
import reckoner.spec.ToolCatalog;
import reckoner.spec.ToolSpec;
import reckoner.tool.ToolId;
import reckoner.tool.ToolRegistry;

/**
 * One call in process, as the HTTP layer makes it once the body is parsed: {@link Invoker#invoke}
 * (schema check, canonical form, the tool, the answer's clean-up), with the answer cache off, so
 * every call computes, and no ledger. The inputs are the worked examples of the tool version's own
 * spec that answer (not those that show an error), split by form: {@code text} (the free-text
 * form, {@code {"text": ...}}) and {@code structured} (the named arguments); each invocation runs
 * the next example, so a figure is the median over the spec's examples, not one lucky input.
 *
 * <p>{@code cached}: the same calls with the default answer cache, every call a hit after the
 * first round: what a repeat costs.
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.SampleTime)
@OutputTimeUnit(TimeUnit.MICROSECONDS)
@Warmup(iterations = 5, time = 2)
@Measurement(iterations = 5, time = 2)
@Fork(value = 1, jvmArgsAppend = {"-Xms512m", "-Xmx512m"})
public class CallBenchmark {
  @Param({"arith@1", "arith@2", "dates@1", "dates@2", "units@1", "units@2", "facts@1"})
  public String tool;

  @Param({"text", "structured"})
  public String form;

  @Param({"false"})
  public boolean cached;

  private Invoker invoker;
  private List<CallRequest> calls;
  private int next;

  @Setup(Level.Trial)
  public void setUp() {
    Clock clock = Clock.fixed(Instant.parse("2031-05-17T09:30:00Z"), ZoneOffset.UTC);
    ToolCatalog catalog = ToolCatalog.of(ToolRegistry.of(Tools.demo()), new SpecLoader(Json.newMapper()));
    invoker = new Invoker(catalog, clock, AnswerCache.ofMaximumSize(cached ? 100_000 : 0));
    calls = examples(catalog, tool, form);
    for (CallRequest c : calls) { // every input must answer, or the figure would time error paths
      Outcome o = invoker.invoke(c);
      if (!o.isOk()) {
        throw new IllegalStateException(tool + " " + c.args() + ": " + o.text());
      }
    }
  }

  /** The spec's answering examples of one form. */
  static List<CallRequest> examples(ToolCatalog catalog, String tool, String form) {
    ToolId id = ToolId.parse(tool);
    ToolSpec spec = catalog.find(id).orElseThrow().spec();
    List<CallRequest> calls = spec.examples().stream()
        .filter(e -> !e.expectsError())
        .filter(e -> e.args().has("text") == form.equals("text"))
        .map(e -> CallRequest.of(id.name(), id.version(), e.args()))
        .toList();
    if (calls.isEmpty()) {
      throw new IllegalStateException(tool + " has no " + form + " examples");
    }
    return calls;
  }

  @Benchmark
  public Outcome call() {
    CallRequest c = calls.get(next);
    next = next + 1 == calls.size() ? 0 : next + 1;
    return invoker.invoke(c);
  }
}
