package reckoner.ledger;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.Statement;
import org.junit.jupiter.api.Test;
import reckoner.Prerequisites;

/**
 * The store contract on PostgreSQL. Needs {@code RECKONER_TEST_PG_URL} (see {@code .ci/postgres.sh});
 * without it these tests are skipped (and fail under CI=true). Each test gets a schema of its own.
 */
final class PostgresLedgerStoreTest extends LedgerStoreContract {
  static final String URL = System.getenv("RECKONER_TEST_PG_URL");
  private static int counter;

  /** A fresh, empty schema in the test database; returns its URL. */
  static String freshSchemaUrl(String prefix) throws Exception {
    Prerequisites.require(URL != null && !URL.isEmpty(), "RECKONER_TEST_PG_URL is not set (run .ci/postgres.sh)");
    String schema = prefix + "_" + ProcessHandle.current().pid() + "_" + (++counter);
    try (Connection c = DriverManager.getConnection(URL); Statement st = c.createStatement()) {
      st.execute("DROP SCHEMA IF EXISTS " + schema + " CASCADE");
      st.execute("CREATE SCHEMA " + schema);
    }
    return URL + (URL.contains("?") ? "&" : "?") + "currentSchema=" + schema;
  }

  @Override
  LedgerStore openEmpty() throws Exception {
    return LedgerStore.postgres(freshSchemaUrl("ledger_test"), null, null, 4);
  }

  @Test
  void open_twice_migratesOnceToVersion2() {
    assertEquals(2, ((PostgresLedgerStore) store).schemaVersion());
    ((PostgresLedgerStore) store).migrate();
    assertEquals(2, ((PostgresLedgerStore) store).schemaVersion());
  }
}
