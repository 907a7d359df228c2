package reckoner.ledger;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import java.util.zip.CRC32C;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;

/**
 * The ledger's intake log: an append-only file where a group of records is durable the moment one
 * write and one {@code fdatasync} have returned, before the records reach the SQLite file (see
 * {@link IntakeLedgerStore}, which feeds them to SQLite and deletes what SQLite holds).
 *
 * <p>A log is a folder of segments, {@code 0000000001.log}, {@code 0000000002.log}, ..., written in
 * turn; a segment is closed at {@link #SEGMENT_BYTES} and never written again. A segment is a run of
 * frames: a 4-byte payload length, the payload's CRC-32C (RFC 3720, appendix B.4; the polynomial
 * {@link CRC32C} computes), then the payload, a count and that many records (see {@link #encode}).
 * All integers are big-endian. A frame is one group commit; reading stops at the first frame that is
 * cut short or fails its check (a write the process did not live to finish, whose records were
 * therefore never acknowledged), and at a length of zero.
 *
 * <p>Not thread-safe: {@link IntakeLedgerStore} calls it under a lock.
 */
final class Intake implements AutoCloseable {
  /** The log's folder, beside the ledger file. */
  static final String FOLDER = "ledger.intake";
  /** A segment is closed once it holds this many bytes. */
  static final long SEGMENT_BYTES = 64L << 20;
  /** A frame's payload is at most this long; a larger group is written as several frames. */
  static final int MAX_FRAME_BYTES = 16 << 20;
  private static final int HEADER_BYTES = 8;
  private static final Logger LOG = LoggerFactory.getLogger(Intake.class);

  private final Path folder;
  private final boolean sync;
  private final long segmentBytes;
  private volatile long segment; // read by the mover thread to delete old segments
  private FileChannel channel;
  private long size;
  private ByteBuffer buffer = ByteBuffer.allocateDirect(64 << 10);

  private Intake(Path folder, boolean sync, long segment, long segmentBytes) {
    this.folder = folder;
    this.sync = sync;
    this.segment = segment;
    this.segmentBytes = segmentBytes;
  }

  /**
   * Opens a new segment after every one in {@code folder} (created if missing); with {@code sync}
   * every {@link #append} reaches the disk before it returns.
   */
  static Intake open(Path folder, boolean sync) throws IOException {
    return open(folder, sync, SEGMENT_BYTES);
  }

  /** {@link #open(Path, boolean)} with segments closed at {@code segmentBytes} (tests: many small segments). */
  static Intake open(Path folder, boolean sync, long segmentBytes) throws IOException {
    Files.createDirectories(folder);
    List<Path> old = segments(folder);
    long next = old.isEmpty() ? 1 : number(old.get(old.size() - 1)) + 1;
    Intake intake = new Intake(folder, sync, next, segmentBytes);
    intake.startSegment(next);
    return intake;
  }

  Path folder() {
    return folder;
  }

  /** The segment being written. */
  long segment() {
    return segment;
  }

  /**
   * Appends {@code records} as one frame (several, past {@link #MAX_FRAME_BYTES}) and, with sync,
   * waits for {@code fdatasync}. On a failure the segment is cut back to where the group began,
   * so that no part of a group that was refused can be read back later, and the next group goes
   * to a new segment.
   *
   * @return the segment the records went to
   */
  long append(List<Invocation> records) throws IOException {
    if (channel == null) { // an earlier failure could not start a new segment
      startSegment(segment + 1);
    } else if (size >= segmentBytes) {
      closeSegment();
      startSegment(segment + 1);
    }
    long start = size;
    try {
      int from = 0;
      while (from < records.size()) {
        from = frame(records, from);
        buffer.flip();
        while (buffer.hasRemaining()) {
          size += channel.write(buffer, size);
        }
      }
      if (sync) {
        channel.force(false);
      }
      return segment;
    } catch (IOException | RuntimeException e) {
      cutBack(start);
      throw e;
    }
  }

  /** Encodes records from {@code from} on into the buffer as one frame; returns the index after the last. */
  private int frame(List<Invocation> records, int from) {
    buffer.clear();
    buffer.position(HEADER_BYTES + 4);
    int to = from;
    while (to < records.size()) {
      int mark = buffer.position();
      try {
        encode(records.get(to), buffer);
      } catch (java.nio.BufferOverflowException e) {
        buffer.position(mark);
        if (to == from || buffer.capacity() < MAX_FRAME_BYTES) { // grow, up to the frame limit, and try again
          grow(Math.max(buffer.capacity() * 2L, (long) encodedSize(records.get(to)) + HEADER_BYTES + 4 + mark));
          continue;
        }
        break; // the frame is full: the rest go to the next one
      }
      to++;
    }
    int payload = buffer.position() - HEADER_BYTES;
    buffer.putInt(HEADER_BYTES, to - from);
    CRC32C crc = new CRC32C();
    ByteBuffer view = buffer.duplicate();
    view.position(HEADER_BYTES).limit(HEADER_BYTES + payload);
    crc.update(view);
    buffer.putInt(0, payload);
    buffer.putInt(4, (int) crc.getValue());
    return to;
  }

  private void grow(long capacity) {
    if (capacity > Integer.MAX_VALUE - 64) {
      throw new IllegalArgumentException("a record too large for the intake log: " + capacity + " bytes");
    }
    ByteBuffer bigger = ByteBuffer.allocateDirect((int) capacity);
    buffer.flip();
    bigger.put(buffer);
    buffer = bigger;
  }

  /** After a failed group: the segment is cut back to the group's start, and later groups go to a new segment. */
  private void cutBack(long start) {
    try {
      channel.truncate(start);
      channel.force(true);
    } catch (IOException | RuntimeException e) {
      LOG.error("the intake log could not be cut back after a failed write; a later start reads {} up to {} bytes only",
          file(segment), start, e);
    }
    try {
      closeSegment();
      startSegment(segment + 1);
    } catch (IOException e) {
      channel = null; // the next append fails at once and the writer retries
      LOG.error("the intake log cannot start a new segment", e);
    }
  }

  private void startSegment(long number) throws IOException {
    Path file = file(number);
    channel = FileChannel.open(file, StandardOpenOption.CREATE_NEW, StandardOpenOption.WRITE);
    segment = number;
    size = 0;
    if (sync) {
      syncFolder(folder); // the new file's name must survive a power loss too
    }
  }

  private void closeSegment() throws IOException {
    if (channel != null) {
      channel.close();
    }
  }

  Path file(long number) {
    return folder.resolve(String.format(java.util.Locale.ROOT, "%010d.log", number));
  }

  /** Deletes the closed segments numbered below {@code number}: their records are all in SQLite. */
  void deleteBefore(long number) {
    for (Path p : segments(folder)) {
      long n = number(p);
      if (n < number && n != segment) {
        try {
          Files.deleteIfExists(p);
        } catch (IOException e) {
          LOG.warn("could not delete the intake log segment {}; a later start reads it again (harmless)", p, e);
        }
      }
    }
  }

  @Override
  public void close() throws IOException {
    closeSegment();
  }

  // ---- reading back ----

  /** What a folder of segments holds: its records in order, and how much could not be read. */
  record Contents(List<Invocation> records, List<Path> segments, long unreadBytes) {}

  /** Reads every segment in {@code folder}, in order, each up to its first cut-short or damaged frame. */
  static Contents read(Path folder) throws IOException {
    List<Invocation> records = new ArrayList<>();
    List<Path> files = segments(folder);
    long unread = 0;
    for (Path file : files) {
      unread += readSegment(file, records);
    }
    return new Contents(records, files, unread);
  }

  /** Appends the segment's records to {@code into}; returns the bytes after its last whole frame. */
  static long readSegment(Path file, List<Invocation> into) throws IOException {
    byte[] bytes = Files.readAllBytes(file);
    ByteBuffer in = ByteBuffer.wrap(bytes).order(ByteOrder.BIG_ENDIAN);
    while (in.remaining() >= HEADER_BYTES) {
      int start = in.position();
      int payload = in.getInt();
      int crc = in.getInt();
      if (payload <= 0 || payload > in.remaining()) {
        in.position(start);
        break;
      }
      CRC32C check = new CRC32C();
      check.update(bytes, in.position(), payload);
      if ((int) check.getValue() != crc) {
        in.position(start);
        break;
      }
      ByteBuffer body = in.slice().limit(payload);
      List<Invocation> frame = new ArrayList<>();
      try {
        int count = body.getInt();
        for (int i = 0; i < count; i++) {
          frame.add(decode(body));
        }
      } catch (RuntimeException e) { // a frame that passed its check yet does not decode: damaged all the same
        LOG.error("intake log segment {}: a frame at byte {} does not decode; reading stops there", file, start, e);
        in.position(start);
        break;
      }
      into.addAll(frame);
      in.position(in.position() + payload);
    }
    long rest = bytes.length - in.position();
    if (rest > 0 && !allZero(bytes, in.position())) {
      LOG.warn("intake log segment {}: the last {} bytes are not a whole frame (a write cut short by a crash); "
          + "their records were never acknowledged", file, rest);
      return rest;
    }
    return 0;
  }

  private static boolean allZero(byte[] bytes, int from) {
    for (int i = from; i < bytes.length; i++) {
      if (bytes[i] != 0) {
        return false;
      }
    }
    return true;
  }

  static List<Path> segments(Path folder) {
    if (!Files.isDirectory(folder)) {
      return List.of();
    }
    try (Stream<Path> files = Files.list(folder)) {
      return files.filter(p -> p.getFileName().toString().matches("[0-9]{10}\\.log")).sorted().toList();
    } catch (IOException e) {
      throw new UncheckedIOException("cannot list the intake log " + folder, e);
    }
  }

  static long number(Path segment) {
    String name = segment.getFileName().toString();
    return Long.parseLong(name.substring(0, name.length() - ".log".length()));
  }

  static void syncFolder(Path folder) throws IOException {
    try (FileChannel dir = FileChannel.open(folder, StandardOpenOption.READ)) {
      dir.force(true);
    }
  }

  // ---- one record ----

  /**
   * A record: its fields in declaration order; a text as a 4-byte length (-1 for null) and its
   * UTF-8 bytes, the version as 4 bytes (-1 for null), cached as one byte, elapsed_us as 8 bytes.
   */
  static void encode(Invocation r, ByteBuffer out) {
    text(r.id(), out);
    text(r.keyId(), out);
    text(r.run(), out);
    text(r.ref(), out);
    text(r.tool(), out);
    out.putInt(r.version() == null ? -1 : r.version());
    text(r.args(), out);
    text(r.text(), out);
    text(r.outcome(), out);
    out.put((byte) (r.cached() ? 1 : 0));
    out.putLong(r.elapsedUs());
    text(r.dataVersion(), out);
    text(r.asOf(), out);
    text(r.idempotencyKey(), out);
    text(r.requestHash(), out);
  }

  /** An upper bound of {@link #encode}'s bytes for {@code r}. */
  static int encodedSize(Invocation r) {
    int n = 4 + 1 + 8;
    for (String s : new String[] {r.id(), r.keyId(), r.run(), r.ref(), r.tool(), r.args(), r.text(), r.outcome(),
        r.dataVersion(), r.asOf(), r.idempotencyKey(), r.requestHash()}) {
      n += 4 + (s == null ? 0 : s.length() * 3);
    }
    return n;
  }

  static Invocation decode(ByteBuffer in) {
    String id = text(in);
    String keyId = text(in);
    String run = text(in);
    String ref = text(in);
    String tool = text(in);
    int version = in.getInt();
    String args = text(in);
    String text = text(in);
    String outcome = text(in);
    boolean cached = in.get() != 0;
    long elapsed = in.getLong();
    String dataVersion = text(in);
    String asOf = text(in);
    String idem = text(in);
    String hash = text(in);
    return new Invocation(id, keyId, run, ref, tool, version < 0 ? null : version, args, text, outcome, cached, elapsed,
        dataVersion, asOf, idem, hash);
  }

  private static void text(String s, ByteBuffer out) {
    if (s == null) {
      out.putInt(-1);
      return;
    }
    byte[] b = s.getBytes(StandardCharsets.UTF_8);
    out.putInt(b.length);
    out.put(b);
  }

  private static String text(ByteBuffer in) {
    int n = in.getInt();
    if (n < 0) {
      return null;
    }
    byte[] b = new byte[n];
    in.get(b);
    return new String(b, StandardCharsets.UTF_8);
  }
}
