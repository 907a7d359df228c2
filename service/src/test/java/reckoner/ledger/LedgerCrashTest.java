package reckoner.ledger;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.BufferedReader;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Kill -9 in the middle of a stream of commits, five times over one ledger file: every id the
 * writing process acknowledged is in the file, and {@code PRAGMA integrity_check} says ok. This
 * is the ledger's half of the crash test; the service's own (through HTTP) builds on it.
 */
final class LedgerCrashTest {
  private static final int KILLS = 5;

  @TempDir Path dir;

  @Test
  void killedMidStream_fiveTimes_everyAcknowledgedIdIsInAnIntactFile() throws Exception {
    List<String> acknowledged = new ArrayList<>();
    for (int round = 0; round < KILLS; round++) {
      Process child = new ProcessBuilder(javaBinary(), "-Xmx256m", "-cp", System.getProperty("java.class.path"),
          CrashChild.class.getName(), dir.toString()).redirectError(ProcessBuilder.Redirect.DISCARD).start();
      int acksThisRound = 0;
      int target = 300 + 250 * round; // kill at a different point each round
      try (BufferedReader in = new BufferedReader(new InputStreamReader(child.getInputStream(), StandardCharsets.UTF_8))) {
        for (String line; acksThisRound < target && (line = in.readLine()) != null; ) {
          if (line.startsWith("ack ")) {
            acknowledged.add(line.substring(4));
            acksThisRound++;
          }
        }
        assertEquals(target, acksThisRound, "the child stopped before it was killed, in round " + round);
        child.toHandle().destroyForcibly(); // SIGKILL on Linux: no shutdown hook, no drain; the pipe stays readable
        assertTrue(child.waitFor(30, TimeUnit.SECONDS));
        // Lines already written before the kill are acknowledgements too.
        for (String line; (line = in.readLine()) != null; ) {
          if (line.startsWith("ack ")) {
            acknowledged.add(line.substring(4));
          }
        }
      }
      assertEquals(137, child.exitValue()); // 128 + signal 9, SIGKILL (POSIX wait status as the JDK reports it, from memory)
      LedgerCheck.Report report = LedgerCheck.check(dir.resolve("ledger.db"), acknowledged);
      assertEquals("ok", report.integrity(), "round " + round);
      assertEquals(0, report.unnamed(), "round " + round + ": records whose names are not in the dictionary");
      assertEquals(List.of(), report.missing(), "round " + round);
      assertTrue(report.invocations() >= acknowledged.size());
    }
  }

  private static String javaBinary() {
    return ProcessHandle.current().info().command().orElse(Path.of(System.getProperty("java.home"), "bin", "java").toString());
  }
}
