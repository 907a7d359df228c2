package reckoner.audit;

import java.time.Clock;
import java.time.Instant;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.TreeMap;
import reckoner.call.CallRequest;
import reckoner.call.Invoker;
import reckoner.call.Outcome;
import reckoner.ledger.Invocation;
import reckoner.spec.ToolCatalog;
import reckoner.tool.ToolId;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * Runs recorded calls again and compares. A record is checked when this build serves its tool
 * version and the record holds its canonical arguments: the call runs with the record's reference
 * time (its {@code as_of} argument, or a clock fixed at the time it read), and its text and outcome
 * must equal the record's byte for byte. A record is not checkable, never counted as passing, when
 * the data it was answered from is no longer loaded (its data version differs from the one the
 * call gets now), when its arguments were never read (refused before), when its tool version is not
 * served, or when its outcome depended on something other than its arguments (a deadline, a
 * splice's markup). Not thread-safe: one audit, one thread.
 */
public final class Audit {
  /** Differences listed in a report at most; all are counted. */
  public static final int LISTED = 1000;

  private final ToolCatalog catalog;
  private final JsonMapper json;
  private final Invoker timeless; // for calls whose reference time is in their arguments
  private final Report report = new Report();

  public Audit(ToolCatalog catalog, JsonMapper json) {
    this.catalog = catalog;
    this.json = json;
    this.timeless = new Invoker(catalog, Clock.fixed(Instant.EPOCH, ZoneOffset.UTC));
  }

  /** What an audit found. */
  public static final class Report {
    long records;
    long same;
    long different;
    long notCheckable;
    final Map<String, long[]> byToolVersion = new TreeMap<>(); // same, different, not checkable
    final Map<String, Long> reasons = new TreeMap<>();
    final List<Difference> differences = new ArrayList<>();

    public long records() {
      return records;
    }

    public long same() {
      return same;
    }

    public long different() {
      return different;
    }

    public long notCheckable() {
      return notCheckable;
    }

    /** Per tool version ({@code arith@1}): same, different, not checkable. */
    public Map<String, long[]> byToolVersion() {
      return byToolVersion;
    }

    /** Why records were not checkable, with how many each. */
    public Map<String, Long> reasons() {
      return reasons;
    }

    /** The first {@link #LISTED} differences. */
    public List<Difference> differences() {
      return differences;
    }
  }

  /** One record whose answer is not what it was. */
  public record Difference(String id, String tool, Integer version, String args, String recordedOutcome, String recordedText,
      String nowOutcome, String nowText) {}

  /** Checks one record. */
  public void check(Invocation record) {
    report.records++;
    String name = record.tool() + "@" + (record.version() == null ? "?" : record.version());
    Optional<String> why = uncheckable(record);
    if (why.isPresent()) {
      notCheckable(name, why.get());
      return;
    }
    JsonNode args = json.readTree(record.args());
    boolean clockRead = record.asOf() != null && !args.has(Invoker.AS_OF);
    Invoker invoker = clockRead ? new Invoker(catalog, Clock.fixed(Instant.parse(record.asOf()), ZoneOffset.UTC)) : timeless;
    Outcome now = invoker.invoke(new CallRequest(record.tool(), OptionalInt.of(record.version()), args, null, null, null));
    String nowOutcome = now.error().map(e -> e.code().wireName()).orElse(Invocation.OK);
    String nowData = now.answer().flatMap(a -> a.dataVersion()).orElse(null);
    if (record.dataVersion() != null && !record.dataVersion().equals(nowData)) {
      notCheckable(name, "the data it was answered from (" + record.dataVersion() + ") is no longer loaded");
      return;
    }
    if (nowOutcome.equals(record.outcome()) && now.text().equals(record.text())) {
      report.same++;
      tally(name)[0]++;
      return;
    }
    ToolId id = ToolId.of(record.tool(), record.version());
    boolean dataBacked = now.canonical().flatMap(c -> catalog.find(id).get().tool().dataVersion(c)).isPresent();
    if (dataBacked && record.dataVersion() == null) {
      notCheckable(name, "a refusal from data whose version the record does not name");
      return;
    }
    report.different++;
    tally(name)[1]++;
    if (report.differences.size() < LISTED) {
      report.differences.add(new Difference(record.id(), record.tool(), record.version(), record.args(), record.outcome(),
          record.text(), nowOutcome, now.text()));
    }
  }

  /** The report so far. */
  public Report report() {
    return report;
  }

  private Optional<String> uncheckable(Invocation record) {
    if (record.version() == null || !ToolId.isValidName(record.tool())
        || catalog.find(ToolId.of(record.tool(), record.version())).isEmpty()) {
      return Optional.of("this build does not serve the tool version");
    }
    if (record.args() == null) {
      return Optional.of("the call was refused before its arguments were read, so there is nothing to run again");
    }
    if (record.outcome().equals("limit_exceeded") && record.text().contains("ran past its deadline")) {
      return Optional.of("the call ran past its deadline, which depends on the load, not on the arguments");
    }
    if (record.outcome().equals("unspliceable")) {
      return Optional.of("the answer was refused by the markup of its splice or fill, which the record does not keep");
    }
    return Optional.empty();
  }

  private void notCheckable(String name, String reason) {
    report.notCheckable++;
    tally(name)[2]++;
    report.reasons.merge(reason, 1L, Long::sum);
  }

  private long[] tally(String name) {
    return report.byToolVersion.computeIfAbsent(name, k -> new long[3]);
  }
}
