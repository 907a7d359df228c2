package reckoner.data;

/**
 * Thrown when a data store cannot be opened because its first load found problems; the report
 * names every file, line and reason.
 */
public final class DataLoadException extends Exception {
  private static final long serialVersionUID = 1L;
  private final transient ReloadReport report;

  DataLoadException(ReloadReport report) {
    super(report.summary());
    this.report = report;
  }

  public ReloadReport report() {
    return report;
  }
}
