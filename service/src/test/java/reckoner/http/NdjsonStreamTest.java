package reckoner.http;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.BufferedReader;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Iterator;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;

/**
 * Two million calls streamed through one NDJSON batch to a server forked with a 64 MiB heap: the
 * input alone is over 100 MB, so the server must stream (read a line, answer a line) to finish.
 * Every answer arrives, in order, with its id.
 */
final class NdjsonStreamTest {
  private static final int CALLS = 2_000_000;
  private static final String HEAP = "-Xmx64m";

  @Test
  void twoMillionCalls_streamThroughABoundedHeap() throws Exception {
    Path data = Files.createTempDirectory("reckoner-stream");
    List<String> command = List.of(Path.of(System.getProperty("java.home"), "bin", "java").toString(), HEAP,
        "-XX:+ExitOnOutOfMemoryError", "-cp", System.getProperty("java.class.path"), "reckoner.Main", "serve",
        "--port", "0", "--data-dir", data.toString());
    Process server = new ProcessBuilder(command).redirectErrorStream(true).start();
    try {
      int port = awaitPort(server);
      long inputBytes = 0;
      Iterator<String> lines = new Iterator<>() {
        int i;
        public boolean hasNext() { return i < CALLS; }
        public String next() {
          int n = i++;
          return "{\"id\":" + n + ",\"tool\":\"arith\",\"args\":{\"expr\":\"" + (n % 5000) + "/7+" + (n % 13) + "\"}}\n";
        }
      };
      IteratorInputStream body = new IteratorInputStream(lines);
      long count = 0;
      // A raw HTTP/1.1 exchange: one thread sends the chunked request while this one reads the
      // chunked answer, as a streaming client must (the server answers before the request ends).
      try (java.net.Socket socket = new java.net.Socket("127.0.0.1", port)) {
        java.io.OutputStream out = new java.io.BufferedOutputStream(socket.getOutputStream(), 1 << 16);
        Thread sender = new Thread(() -> {
          try {
            out.write(("POST /v1/batch HTTP/1.1\r\nHost: 127.0.0.1\r\nContent-Type: application/x-ndjson\r\n"
                + "Transfer-Encoding: chunked\r\n\r\n").getBytes(StandardCharsets.US_ASCII));
            byte[] chunk = new byte[1 << 15];
            for (int n; (n = body.read(chunk, 0, chunk.length)) > 0; ) {
              out.write((Integer.toHexString(n) + "\r\n").getBytes(StandardCharsets.US_ASCII));
              out.write(chunk, 0, n);
              out.write("\r\n".getBytes(StandardCharsets.US_ASCII));
            }
            out.write("0\r\n\r\n".getBytes(StandardCharsets.US_ASCII));
            out.flush();
          } catch (java.io.IOException e) {
            throw new java.io.UncheckedIOException(e);
          }
        }, "ndjson-sender");
        sender.start();
        InputStream in = new java.io.BufferedInputStream(socket.getInputStream(), 1 << 16);
        String status = ChunkedReader.line(in);
        assertEquals("HTTP/1.1 200 OK", status);
        boolean chunked = false;
        StringBuilder headers = new StringBuilder();
        for (String h; !(h = ChunkedReader.line(in)).isEmpty(); ) {
          chunked |= h.equalsIgnoreCase("Transfer-Encoding: chunked");
          headers.append(h).append('|');
        }
        assertTrue(chunked, "the answer is streamed, not buffered whole: " + headers);
        BufferedReader reader = new BufferedReader(new InputStreamReader(new ChunkedReader(in), StandardCharsets.UTF_8));
        String trailer = null;
        for (String line; (line = reader.readLine()) != null; ) {
          if (count == CALLS) {
            trailer = line;
            continue;
          }
          String prefix = "{\"id\":" + count + ",\"ok\":true,";
          String got = line;
          assertTrue(got.startsWith(prefix), () -> "line in order with its id: " + got);
          count++;
        }
        assertEquals("{\"end\":true,\"complete\":true,\"answered\":" + CALLS + ",\"replayed\":0}", trailer);
        sender.join();
      }
      inputBytes = body.bytes;
      assertEquals(CALLS, count);
      assertTrue(inputBytes > 100_000_000L, "the input (" + inputBytes + " bytes) is well above the 64 MiB heap");
      assertTrue(server.isAlive(), "the server did not run out of memory");
    } finally {
      server.destroy();
      server.waitFor(20, TimeUnit.SECONDS);
    }
  }

  static int awaitPort(Process server) throws Exception {
    BufferedReader out = new BufferedReader(new InputStreamReader(server.getInputStream(), StandardCharsets.UTF_8));
    Pattern p = Pattern.compile("on http://127\\.0\\.0\\.1:(\\d+)");
    long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(60);
    for (String line; System.nanoTime() < deadline && (line = out.readLine()) != null; ) {
      Matcher m = p.matcher(line);
      if (m.find()) {
        Thread drain = new Thread(() -> out.lines().forEach(l -> { }), "server-output");
        drain.setDaemon(true);
        drain.start();
        return Integer.parseInt(m.group(1));
      }
    }
    throw new IllegalStateException("the forked server did not report its port");
  }

  /** Decodes an HTTP/1.1 chunked body (RFC 9112, section 7.1). */
  static final class ChunkedReader extends InputStream {
    private final InputStream in;
    private long left;
    private boolean done;

    ChunkedReader(InputStream in) {
      this.in = in;
    }

    static String line(InputStream in) throws java.io.IOException {
      StringBuilder sb = new StringBuilder();
      for (int c; (c = in.read()) != -1 && c != '\n'; ) {
        if (c != '\r') {
          sb.append((char) c);
        }
      }
      return sb.toString();
    }

    @Override
    public int read() throws java.io.IOException {
      byte[] one = new byte[1];
      return read(one, 0, 1) < 0 ? -1 : one[0] & 0xff;
    }

    @Override
    public int read(byte[] b, int off, int len) throws java.io.IOException {
      if (done) {
        return -1;
      }
      if (left == 0) {
        String size = line(in).trim();
        if (size.isEmpty()) {
          size = line(in).trim(); // the CRLF after the previous chunk
        }
        left = Long.parseLong(size.split(";")[0], 16);
        if (left == 0) {
          done = true;
          return -1;
        }
      }
      int n = in.read(b, off, (int) Math.min(len, left));
      if (n > 0) {
        left -= n;
      }
      return n;
    }
  }

  /** Lines produced on demand, so the client never holds the input either. */
  static final class IteratorInputStream extends InputStream {
    private final Iterator<String> lines;
    private byte[] current = new byte[0];
    private int pos;
    long bytes;

    IteratorInputStream(Iterator<String> lines) {
      this.lines = lines;
    }

    @Override
    public int read() {
      byte[] one = new byte[1];
      return read(one, 0, 1) < 0 ? -1 : one[0] & 0xff;
    }

    @Override
    public int read(byte[] b, int off, int len) {
      int written = 0;
      while (written < len) {
        if (pos == current.length) {
          if (!lines.hasNext()) {
            break;
          }
          current = lines.next().getBytes(StandardCharsets.UTF_8);
          pos = 0;
        }
        int n = Math.min(len - written, current.length - pos);
        System.arraycopy(current, pos, b, off + written, n);
        pos += n;
        written += n;
      }
      bytes += written;
      return written == 0 && len > 0 ? -1 : written;
    }
  }
}
