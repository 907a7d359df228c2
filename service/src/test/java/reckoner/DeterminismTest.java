package reckoner;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * The same corpus of calls gives byte-identical answers whatever the JVM's default locale, time
 * zone and file encoding: each row forks a JVM with those defaults and compares its output with
 * this JVM's.
 */
final class DeterminismTest {
  private static String reference;

  @BeforeAll
  static void runHere() throws Exception {
    ByteArrayOutputStream bytes = new ByteArrayOutputStream();
    PrintStream out = new PrintStream(bytes, false, StandardCharsets.UTF_8);
    CorpusRunner.run(out);
    out.flush();
    reference = bytes.toString(StandardCharsets.UTF_8);
    assertTrue(reference.lines().count() >= 50, "the corpus must hold at least 50 calls");
  }

  @ParameterizedTest(name = "{0}-{1}, {2}")
  @CsvSource({
      "tr, TR, Pacific/Kiritimati, UTF-8",
      "ar, EG, Pacific/Kiritimati, UTF-8",
      "de, DE, Pacific/Kiritimati, UTF-8",
      "hi, IN, Pacific/Kiritimati, UTF-8",
      "tr, TR, America/St_Johns, ISO-8859-9"})
  void corpus_isByteIdentical_underOtherDefaults(String language, String country, String zone, String encoding) throws Exception {
    List<String> command = new ArrayList<>();
    command.add(Path.of(System.getProperty("java.home"), "bin", "java").toString());
    command.add("-Duser.language=" + language);
    command.add("-Duser.country=" + country);
    command.add("-Duser.timezone=" + zone);
    command.add("-Dfile.encoding=" + encoding);
    command.add("-Xshare:auto");
    command.add("-cp");
    command.add(System.getProperty("java.class.path"));
    command.add(CorpusRunner.class.getName());
    Process p = new ProcessBuilder(command).redirectError(ProcessBuilder.Redirect.INHERIT).start();
    byte[] output = p.getInputStream().readAllBytes();
    assertTrue(p.waitFor(120, TimeUnit.SECONDS), "fork finished");
    assertEquals(0, p.exitValue());
    String forked = new String(output, StandardCharsets.UTF_8);
    assertEquals(reference.lines().count(), forked.lines().count());
    assertEquals(reference, forked);
  }
}
