package reckoner.data;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * What one load or reload of a store's data files came to. A reload is all or nothing: when any
 * file has a problem, nothing is swapped ({@code applied} is false) and every dataset keeps serving
 * its previous data version. Immutable.
 *
 * @param kind what the files hold, as the log says it ({@code facts}, {@code search collections})
 * @param applied whether the new data replaced the old
 * @param files every file read, in load order, with its record count and problems
 * @param changes every dataset served before or after, by name, with its data version before and after
 */
public record ReloadReport(String kind, boolean applied, List<FileResult> files, List<Change> changes) {
  public ReloadReport {
    Objects.requireNonNull(kind, "kind");
    files = List.copyOf(files);
    changes = List.copyOf(changes);
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

  /** One file's outcome: how many records it held and what was wrong with it (empty when ok). */
  public record FileResult(String file, int records, List<Problem> problems) {
    public FileResult {
      Objects.requireNonNull(file, "file");
      problems = List.copyOf(problems);
    }

    public boolean isOk() {
      return problems.isEmpty();
    }
  }

  /** A dataset's data version before and after; empty where the dataset did not exist. */
  public record Change(String name, Optional<String> before, Optional<String> after, int records) {
    public Change {
      Objects.requireNonNull(name, "name");
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

  /** One line for a log: applied or not, each dataset's version, or the first problem. */
  public String summary() {
    StringBuilder sb = new StringBuilder(kind).append(applied ? " loaded:" : " not reloaded, old data kept:");
    if (!applied) {
      List<Problem> problems = problems();
      sb.append(' ').append(problems.size()).append(problems.size() == 1 ? " problem, first " : " problems, first ")
          .append(problems.isEmpty() ? "none" : problems.get(0).toString()).append(';');
    }
    for (Change c : changes) {
      sb.append(' ').append(c.name()).append(' ').append(c.after().or(c::before).orElse("(none)"));
    }
    return sb.toString();
  }
}
