package reckoner;

import ch.qos.logback.classic.LoggerContext;
import org.slf4j.LoggerFactory;

/** The one step of the logging backend's life that the wiring takes: writing out what is queued, at exit. */
final class Logs {
  private Logs() {}

  /**
   * Stops the logging context: its batching appender first writes every line it holds (waiting up to
   * 5 s for a write in progress). Call once, last, before the process exits; later events are dropped.
   */
  static void flush() {
    if (LoggerFactory.getILoggerFactory() instanceof LoggerContext context) {
      context.stop();
    }
  }
}
