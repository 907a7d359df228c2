package reckoner.facts;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * What one load or reload of the fact files came to. A reload is all or nothing: when any file
 * has a problem, nothing is swapped ({@code applied} is false) and every set keeps serving its
 * previous data version. Immutable.
 *
 * @param applied whether the new facts replaced the old ones
 * @param files every file read, in load order, with its fact count and problems
 * @param sets every set served before or after, by name, with its data version before and after
 */
public record ReloadReport(boolean applied, List<FileResult> files, List<SetChange> sets) {
  public ReloadReport {
    files = List.copyOf(files);
    sets = List.copyOf(sets);
  }

  /** Why a line (or, at line 0, a whole file or directory) could not be loaded. */
  public record Problem(String file, int line, String reason) {
    public Problem {
      Objects.requireNonNull(file, "file");
      Objects.requireNonNull(reason, "reason");
    }

    /** {@code file:line: reason}, or {@code file: reason} for a whole-file problem. */
    @Override
    public String toString() {
      return line > 0 ? file + ":" + line + ": " + reason : file + ": " + reason;
    }
  }

  /** One file's outcome: how many facts it held and what was wrong with it (empty when ok). */
  public record FileResult(String file, int facts, List<Problem> problems) {
    public FileResult {
      Objects.requireNonNull(file, "file");
      problems = List.copyOf(problems);
    }

    public boolean isOk() {
      return problems.isEmpty();
    }
  }

  /** A set's data version before and after; empty where the set did not exist. */
  public record SetChange(String set, Optional<String> before, Optional<String> after, int facts) {
    public SetChange {
      Objects.requireNonNull(set, "set");
      Objects.requireNonNull(before, "before");
      Objects.requireNonNull(after, "after");
    }

    public boolean isChanged() {
      return !before.equals(after);
    }
  }

  /** Every problem of every file, in load order. */
  public List<Problem> problems() {
    List<Problem> all = new ArrayList<>();
    files.forEach(f -> all.addAll(f.problems()));
    return all;
  }

  /** One line for a log: applied or not, each set's version, or the first problem. */
  public String summary() {
    StringBuilder sb = new StringBuilder(applied ? "facts loaded:" : "facts not reloaded, old data kept:");
    if (!applied) {
      List<Problem> problems = problems();
      sb.append(' ').append(problems.size()).append(problems.size() == 1 ? " problem, first " : " problems, first ")
          .append(problems.isEmpty() ? "none" : problems.get(0).toString()).append(';');
    }
    for (SetChange s : sets) {
      sb.append(' ').append(s.set()).append(' ').append(s.after().or(s::before).orElse("(none)"));
    }
    return sb.toString();
  }
}
