package reckoner.data;

import java.util.List;
import java.util.Map;

/**
 * How one kind of data file is read and turned into datasets. A {@link DataStore} makes a new
 * instance for every load: {@link #read} sees every non-blank line of every file in load order,
 * then {@link #assemble} builds the datasets. Problems go to the file and line that caused them;
 * the store serves the new datasets only when there were none. Not thread-safe (one load uses it).
 */
public interface DataFormat<D extends Dataset> {
  /** Reports a problem at a file and line (line 0: the whole file). */
  interface ProblemSink {
    void add(String file, int line, String reason);

    /** How many problems were reported so far in this load, reading included. */
    int count();
  }

  /** What {@link #assemble} may use besides what it read. */
  record Assembly<D extends Dataset>(List<DataSource.Input> inputs, ProblemSink problems, DataSnapshot<D> previous) {}

  /** Longest line accepted, in bytes of UTF-8; a longer line is a problem. */
  int maxLineBytes();

  /**
   * Reads one line; returns whether it is a record counted in the file's total (a declaration
   * line is not).
   *
   * @throws DataLine.Problem if the line cannot be loaded
   */
  boolean read(DataLine line) throws DataLine.Problem;

  /**
   * Builds the datasets from the lines read. Called once, after every file was read, even when
   * problems were found (to report more of them); {@code previous} is what the store serves now,
   * whose unchanged datasets may be returned again as they are.
   */
  Map<String, D> assemble(Assembly<D> assembly);
}
