package reckoner.ledger;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static reckoner.ledger.Fixtures.HERON;
import static reckoner.ledger.Fixtures.call;
import static reckoner.ledger.Fixtures.id;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

final class LedgerCheckTest {
  @TempDir Path dir;

  private void write(int n) {
    try (LedgerStore store = LedgerStore.sqlite(dir)) {
      for (int i = 0; i < n; i++) {
        store.append(List.of(call(i, 0, HERON).build()));
      }
    }
  }

  @Test
  void check_intactFile_reportsCountAndMissingIdsInOrderAsked() throws Exception {
    write(3);
    LedgerCheck.Report report = LedgerCheck.check(dir.resolve("ledger.db"), List.of(id(2, 0), id(7, 0), id(0, 0), id(8, 0)));
    assertEquals(new LedgerCheck.Report("ok", 3, 0, List.of(id(7, 0), id(8, 0))), report);
  }

  @Test
  void run_withIdsFile_printsFindingsAndExitsOneWhenAnyIsMissing() throws Exception {
    write(2);
    Path ids = dir.resolve("acked.txt");
    Files.writeString(ids, id(0, 0) + "\n\n" + id(5, 0) + "\n");
    ByteArrayOutputStream bytes = new ByteArrayOutputStream();
    int code = LedgerCheck.run(new String[] {dir.resolve("ledger.db").toString(), ids.toString()},
        new PrintStream(bytes, true, StandardCharsets.UTF_8));
    assertEquals(1, code);
    assertEquals("integrity: ok\ninvocations: 2\nunnamed: 0\nmissing: 1\n" + id(5, 0) + "\n",
        bytes.toString(StandardCharsets.UTF_8).replace(System.lineSeparator(), "\n"));
  }

  @Test
  void run_allPresent_exitsZero() throws Exception {
    write(1);
    Path ids = dir.resolve("acked.txt");
    Files.writeString(ids, id(0, 0) + "\n");
    assertEquals(0, LedgerCheck.run(new String[] {dir.resolve("ledger.db").toString(), ids.toString()},
        new PrintStream(new ByteArrayOutputStream(), true, StandardCharsets.UTF_8)));
  }

  /** A record whose tool number has lost its name cannot be read back whole: the file is not intact. */
  @Test
  void check_recordWithNumberMissingFromDictionary_isNotIntact() throws Exception {
    write(2);
    try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + dir.resolve("ledger.db")); Statement st = c.createStatement()) {
      st.execute("UPDATE invocations SET tool_n = 999 WHERE seq = (SELECT max(seq) FROM invocations)");
    }
    LedgerCheck.Report report = LedgerCheck.check(dir.resolve("ledger.db"), List.of(id(0, 0)));
    assertEquals(new LedgerCheck.Report("ok", 2, 1, List.of()), report);
    assertFalse(report.isIntact());
  }

  @Test
  void run_badUsage_exitsTwo() throws Exception {
    assertEquals(2, LedgerCheck.run(new String[0], new PrintStream(new ByteArrayOutputStream(), true, StandardCharsets.UTF_8)));
  }

  @Test
  void check_noFile_failsNamingIt() {
    SQLException e = assertThrows(SQLException.class, () -> LedgerCheck.check(dir.resolve("absent.db"), List.of()));
    assertEquals("no ledger file at " + dir.resolve("absent.db"), e.getMessage());
  }
}
