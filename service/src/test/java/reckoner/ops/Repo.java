package reckoner.ops;

import static org.junit.jupiter.api.Assertions.fail;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Assumptions;

/** The repository's files, and the outside programs some tests run. */
final class Repo {
  private Repo() {}

  /** The repository root (Maven passes it; from an IDE the module's parent). */
  static Path root() {
    String dir = System.getProperty("reckoner.repo.dir");
    return (dir != null ? Path.of(dir) : Path.of("..")).toAbsolutePath().normalize();
  }

  static Path file(String relative) {
    return root().resolve(relative);
  }

  static String read(String relative) {
    try {
      return Files.readString(file(relative), StandardCharsets.UTF_8);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  /** Whether this run is CI's, where a missing outside program fails a test instead of skipping it. */
  static boolean inCi() {
    return "true".equalsIgnoreCase(System.getenv("CI"));
  }

  /**
   * The program at {@code path}. When it is missing: under {@code CI=true} the test fails, so that a
   * broken CI machine cannot pass by skipping; elsewhere the test is skipped, saying what to install.
   */
  static Path program(String path, String debianPackage) {
    Path p = Path.of(path);
    if (!Files.isExecutable(p)) {
      String message = path + " is missing: install Debian's " + debianPackage + " (ops/ci-tools.sh does)";
      if (inCi()) {
        fail(message);
      }
      Assumptions.abort(message);
    }
    return p;
  }
}
