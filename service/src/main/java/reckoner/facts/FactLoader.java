package reckoner.facts;

import java.io.IOException;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

/**
 * Reads every source and builds a complete new {@link Snapshot}, or reports why it cannot: the
 * whole new data is parsed and validated before anything is served from it. Stateless.
 */
final class FactLoader {
  /** A load's outcome: the snapshot (null when any problem was found) and each file's result. */
  record Result(Snapshot snapshot, List<ReloadReport.FileResult> files, Object fingerprint) {
    boolean isOk() {
      return snapshot != null;
    }
  }

  private FactLoader() {}

  static Result load(List<FactSource> sources) {
    List<Object> fingerprint = new ArrayList<>();
    sources.forEach(s -> fingerprint.add(s.fingerprint())); // before reading: a change during the read shows next time
    List<FactFileReader.FileRead> reads = new ArrayList<>();
    List<ReloadReport.FileResult> unreadable = new ArrayList<>();
    for (FactSource source : sources) {
      try {
        source.inputs().forEach(input -> reads.add(FactFileReader.read(input)));
      } catch (IOException e) {
        unreadable.add(new ReloadReport.FileResult(source.toString(), 0,
            List.of(new ReloadReport.Problem(source.toString(), 0, "cannot list fact files: " + e.getMessage()))));
      }
    }
    Map<String, FactFileReader.Problems> problems = new LinkedHashMap<>();
    reads.forEach(r -> problems.put(r.file(), r.problems()));
    FactSetBuilder.ProblemSink sink = (file, line, reason) -> problems.get(file).add(line, reason);

    Map<String, List<FactFileReader.RawFact>> bySet = new TreeMap<>();
    Map<String, FactFileReader.Declaration> declared = new TreeMap<>();
    for (FactFileReader.FileRead r : reads) {
      r.facts().forEach(f -> bySet.computeIfAbsent(f.set(), n -> new ArrayList<>()).add(f));
      for (FactFileReader.Declaration d : r.declarations()) {
        FactFileReader.Declaration first = declared.putIfAbsent(d.set(), d);
        if (first != null) {
          sink.add(d.file(), d.line(), "options of set \"" + d.set() + "\" are already declared at "
              + first.file() + ":" + first.line());
        }
      }
    }
    Map<String, FactSet> sets = new TreeMap<>();
    bySet.forEach((name, facts) -> {
      FactFileReader.Declaration d = declared.get(name);
      sets.put(name, new FactSetBuilder(name, d != null && d.foldAccents(), sink, facts.size()).build(facts));
    });

    List<ReloadReport.FileResult> files = new ArrayList<>(unreadable);
    boolean ok = unreadable.isEmpty();
    for (FactFileReader.FileRead r : reads) {
      FactFileReader.Problems p = problems.get(r.file());
      ok &= p.isEmpty();
      files.add(new ReloadReport.FileResult(r.file(), r.facts().size(), p.list()));
    }
    return new Result(ok ? new Snapshot(sets) : null, files, fingerprint);
  }
}
