package reckoner.data;

import java.util.ArrayList;
import java.util.List;

/** A bounded list of one file's problems: the first ten are kept, the rest counted. Not thread-safe. */
final class FileProblems {
  /** Problems listed per file; more are counted in one last line. */
  static final int MAX_SHOWN = 10;

  private final String file;
  private final List<ReloadReport.Problem> shown = new ArrayList<>();
  private int count;

  FileProblems(String file) {
    this.file = file;
  }

  void add(int line, String reason) {
    count++;
    if (shown.size() < MAX_SHOWN) {
      shown.add(new ReloadReport.Problem(file, line, reason));
    }
  }

  int count() {
    return count;
  }

  List<ReloadReport.Problem> list() {
    List<ReloadReport.Problem> all = new ArrayList<>(shown);
    if (count > shown.size()) {
      all.add(new ReloadReport.Problem(file, 0, (count - shown.size()) + " more problems not shown"));
    }
    return all;
  }
}
