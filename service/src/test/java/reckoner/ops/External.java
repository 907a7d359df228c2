package reckoner.ops;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;

/** Runs an outside program to its end and keeps what it printed. */
record External(int exitCode, String output) {
  static External run(Path directory, String input, String... command) {
    try {
      Process p = new ProcessBuilder(List.of(command)).directory(directory.toFile()).redirectErrorStream(true).start();
      if (input != null) {
        p.getOutputStream().write(input.getBytes(StandardCharsets.UTF_8));
      }
      p.getOutputStream().close();
      String out = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
      if (!p.waitFor(120, TimeUnit.SECONDS)) {
        p.destroyForcibly();
        throw new AssertionError(String.join(" ", command) + " did not finish in 120 s");
      }
      return new External(p.exitValue(), out);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw new IllegalStateException(e);
    }
  }

  static List<String> command(Path program, String... args) {
    List<String> c = new ArrayList<>();
    c.add(program.toString());
    c.addAll(List.of(args));
    return c;
  }
}
