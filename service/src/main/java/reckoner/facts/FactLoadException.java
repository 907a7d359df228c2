package reckoner.facts;

/**
 * Thrown when a fact store cannot be opened because its first load found problems; the report
 * names every file, line and reason.
 */
public final class FactLoadException extends Exception {
  private static final long serialVersionUID = 1L;
  private final transient ReloadReport report;

  FactLoadException(ReloadReport report) {
    super(report.summary());
    this.report = report;
  }

  public ReloadReport report() {
    return report;
  }
}
