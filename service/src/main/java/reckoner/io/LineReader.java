package reckoner.io;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.InputStream;

/**
 * Reads a byte stream line by line ({@code \n}, with an optional {@code \r} before it), holding at
 * most one line of at most {@code maxLine} bytes; a longer line is skipped to its end and reported
 * as too long, so one huge line cannot exhaust memory. Not thread-safe.
 */
public final class LineReader {
  /** One line without its terminator; {@code tooLong} lines carry no bytes. */
  public record Line(long number, byte[] bytes, boolean tooLong) {
    public boolean isBlank() {
      if (tooLong) {
        return false;
      }
      for (byte b : bytes) {
        if (b != ' ' && b != '\t' && b != '\r') {
          return false;
        }
      }
      return true;
    }
  }

  private final InputStream in;
  private final long maxLine;
  private final byte[] buffer = new byte[1 << 16];
  private int pos;
  private int limit;
  private long number;
  private final ByteArrayOutputStream current = new ByteArrayOutputStream(256);

  public LineReader(InputStream in, long maxLine) {
    this.in = in;
    this.maxLine = maxLine;
  }

  /**
   * Whether bytes already read from the stream are waiting: when not, the next {@link #next()}
   * reads the stream and may block until the sender sends more.
   */
  public boolean hasBuffered() {
    return pos < limit;
  }

  /** The next line, or null at the end of the stream. */
  public Line next() throws IOException {
    current.reset();
    boolean tooLong = false;
    boolean sawAny = false;
    while (true) {
      if (pos == limit) {
        limit = in.read(buffer);
        pos = 0;
        if (limit <= 0) {
          limit = 0;
          if (!sawAny) {
            return null;
          }
          return finish(tooLong);
        }
      }
      sawAny = true;
      int start = pos;
      while (pos < limit && buffer[pos] != '\n') {
        pos++;
      }
      if (!tooLong) {
        current.write(buffer, start, pos - start);
        if (current.size() > maxLine) {
          tooLong = true;
          current.reset();
        }
      }
      if (pos < limit) { // found '\n'
        pos++;
        return finish(tooLong);
      }
    }
  }

  private Line finish(boolean tooLong) {
    number++;
    if (tooLong) {
      return new Line(number, new byte[0], true);
    }
    byte[] bytes = current.toByteArray();
    int len = bytes.length;
    if (len > 0 && bytes[len - 1] == '\r') {
      bytes = java.util.Arrays.copyOf(bytes, len - 1);
    }
    return new Line(number, bytes, false);
  }
}
