package reckoner.ledger;

import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.ArrayList;
import java.util.Collection;
import java.util.List;
import java.util.Objects;
import java.util.UUID;

/**
 * Checks an SQLite ledger file after a crash: runs {@code PRAGMA integrity_check}, counts the
 * records, counts the records whose key, run or tool number has no name in the dictionary
 * ({@code PRAGMA foreign_key_check}: such a record could not be read back whole), and finds which
 * of a list of ids (those acknowledged to clients) are missing.
 *
 * <p>As a program: {@code LedgerCheck LEDGER_FILE [IDS_FILE]}, where IDS_FILE holds one id a line.
 * Prints {@code integrity: ok}, {@code invocations: N}, {@code unnamed: U}, {@code missing: K} and
 * each missing id; exits 0 when the file is intact and nothing is missing, 1 otherwise, 2 on bad usage.
 */
public final class LedgerCheck {
  private LedgerCheck() {}

  /**
   * What a check found. Immutable.
   *
   * @param integrity the result of {@code PRAGMA integrity_check}: {@code ok} or SQLite's findings
   * @param invocations the number of records in the file
   * @param unnamed the records that name a key, run or tool number missing from the dictionary
   * @param missing the ids asked about that the file does not hold, in the order asked
   */
  public record Report(String integrity, long invocations, long unnamed, List<String> missing) {
    public Report {
      Objects.requireNonNull(integrity, "integrity");
      missing = List.copyOf(missing);
    }

    public boolean isIntact() {
      return integrity.equals("ok") && unnamed == 0;
    }
  }

  /**
   * Checks {@code file} (opened as the service opens it, so a WAL left by a crash is recovered first,
   * and records a crash left in the intake log beside it are moved in first) for integrity and for
   * each of {@code ids}.
   */
  public static Report check(Path file, Collection<String> ids) throws SQLException {
    if (!Files.isRegularFile(file)) {
      throw new SQLException("no ledger file at " + file);
    }
    Path dir = file.toAbsolutePath().getParent();
    if (file.getFileName().toString().equals(SqliteLedgerStore.FILE_NAME)) {
      IntakeLedgerStore.recover(dir);
    }
    try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + file.toAbsolutePath())) {
      StringBuilder integrity = new StringBuilder();
      try (Statement st = c.createStatement(); ResultSet rs = st.executeQuery("PRAGMA integrity_check")) {
        while (rs.next()) {
          if (integrity.length() > 0) {
            integrity.append("; ");
          }
          integrity.append(rs.getString(1));
        }
      }
      long count;
      try (Statement st = c.createStatement(); ResultSet rs = st.executeQuery("SELECT count(*) FROM invocations")) {
        rs.next();
        count = rs.getLong(1);
      }
      long unnamed = 0;
      try (Statement st = c.createStatement(); ResultSet rs = st.executeQuery("PRAGMA foreign_key_check(invocations)")) {
        while (rs.next()) {
          unnamed++; // one row per record and reference without its name
        }
      }
      List<String> missing = new ArrayList<>();
      try (PreparedStatement ps = c.prepareStatement("SELECT 1 FROM invocations WHERE seq = ? AND id_lo = ?")) {
        for (String id : ids) {
          UUID uuid = UUID.fromString(id);
          ps.setLong(1, uuid.getMostSignificantBits());
          ps.setLong(2, uuid.getLeastSignificantBits());
          try (ResultSet rs = ps.executeQuery()) {
            if (!rs.next()) {
              missing.add(id);
            }
          }
        }
      }
      return new Report(integrity.toString(), count, unnamed, missing);
    }
  }

  public static void main(String[] args) throws IOException, SQLException {
    System.exit(run(args, System.out));
  }

  static int run(String[] args, PrintStream out) throws IOException, SQLException {
    if (args.length < 1 || args.length > 2) {
      out.println("usage: LedgerCheck LEDGER_FILE [IDS_FILE]");
      return 2;
    }
    List<String> ids = new ArrayList<>();
    if (args.length == 2) {
      for (String line : Files.readAllLines(Path.of(args[1]), StandardCharsets.UTF_8)) {
        if (!line.isBlank()) {
          ids.add(line.strip());
        }
      }
    }
    Report report = check(Path.of(args[0]), ids);
    out.println("integrity: " + report.integrity());
    out.println("invocations: " + report.invocations());
    out.println("unnamed: " + report.unnamed());
    out.println("missing: " + report.missing().size());
    report.missing().forEach(out::println);
    return report.isIntact() && report.missing().isEmpty() ? 0 : 1;
  }
}
