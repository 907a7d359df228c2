package reckoner.conformance;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.DynamicTest;
import org.junit.jupiter.api.TestFactory;

/**
 * README, every section with shell examples ("A short tour", "Many calls at once, splicing and
 * filling", "The ledger", ...): each command runs, in README order, against the shipped jar on
 * loopback (localhost:8080 read as the test server's address, {@code service/target/reckoner.jar} as
 * the jar under test, in a scratch directory), and prints what the README shows under it. A command
 * with nothing shown must succeed and, if it is a request whose answer is printed, not answer a
 * problem. (The set-up section's two commands are what CI runs.)
 */
final class ReadmeExamplesIT {
  private static JarServer server;
  private static Path workDir;

  @BeforeAll
  static void start() throws IOException {
    server = JarServer.start("readme-examples", List.of(), Map.of());
    workDir = Files.createTempDirectory("readme-examples");
  }

  @AfterAll
  static void stop() {
    server.close();
  }

  @TestFactory
  Stream<DynamicTest> everyReadmeExample_printsWhatTheReadmeShows() throws IOException {
    List<ReadmeExamples.Example> examples = ReadmeExamples.read();
    assertTrue(examples.size() >= 30, "the README's examples were found: " + examples.size());
    return examples.stream().map(e -> DynamicTest.dynamicTest(e.toString(), () -> check(e)));
  }

  private static void check(ReadmeExamples.Example e) throws Exception {
    String command = e.command()
        .replace("localhost:8080", "127.0.0.1:" + server.port())
        .replace("service/target/reckoner.jar", JarServer.jar().toAbsolutePath().toString());
    ProcessBuilder pb = new ProcessBuilder("bash", "-c", "set -o pipefail; " + command).directory(workDir.toFile())
        .redirectErrorStream(true);
    pb.environment().keySet().removeIf(k -> k.startsWith("RECKONER_"));
    Process p = pb.start();
    String output = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
    assertTrue(p.waitFor(120, TimeUnit.SECONDS), "finished");
    assertEquals(0, p.exitValue(), "exit code; output:\n" + output);
    if (e.expected() != null) {
      assertTrue(e.matches(output), "the README shows\n  " + e.expected() + "\nbut the command printed\n  " + output.strip());
    } else if (command.startsWith("curl") && !command.contains(" > ")) {
      assertFalse(output.isBlank(), "an answer");
      assertFalse(output.contains("\"type\":\"/problems/"), "not a problem: " + output);
    }
  }
}
