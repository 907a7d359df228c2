package reckoner;

import static org.junit.jupiter.api.Assertions.fail;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

/**
 * Tests that need a part outside the JVM (a PostgreSQL cluster, a browser, a Debian tool) say so
 * here. Outside CI a missing part skips the test with the reason; under {@code CI=true} it fails
 * the test, so a CI run can never pass with a part silently left out.
 */
public final class Prerequisites {
  private Prerequisites() {}

  /** Whether this run is CI's ({@code CI=true} in the environment, as {@code .ci/run} sets it). */
  public static boolean inCi() {
    return "true".equalsIgnoreCase(System.getenv("CI"));
  }

  /** Skips (outside CI) or fails (in CI) the calling test unless {@code present}; {@code what} says what is missing. */
  public static void require(boolean present, String what) {
    if (present) {
      return;
    }
    if (inCi()) {
      fail(what + " (CI=true: a missing part fails the run; see .ci/run)");
    }
    assumeTrue(false, what + ": skipped outside CI");
  }
}
