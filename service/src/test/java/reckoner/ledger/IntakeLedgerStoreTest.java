package reckoner.ledger;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static reckoner.ledger.Fixtures.HERON;
import static reckoner.ledger.Fixtures.call;

import java.io.RandomAccessFile;
import java.nio.ByteBuffer;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.UUID;
import java.util.zip.CRC32C;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import reckoner.ledger.InvocationQuery.Scope;

/**
 * The intake log in front of the SQLite file: what a commit leaves on disk, how a start after a
 * crash reads it back (a write cut short, a damaged frame), how segments come and go, and what
 * happens to a record the file refuses. The store's outward behaviour is the contract's, checked in
 * {@link SqliteLedgerStoreTest} through the same store.
 */
final class IntakeLedgerStoreTest {
  @TempDir Path dir;

  private static List<Invocation> records(int from, int count) {
    List<Invocation> list = new ArrayList<>();
    for (int i = from; i < from + count; i++) {
      list.add(call(i, 0, HERON).run("orchard-survey-7").ref("plot-" + i + ":row-1").build());
    }
    return list;
  }

  private Path folder() {
    return dir.resolve(Intake.FOLDER);
  }

  @Test
  void encodeDecode_keepsEveryField_nullsAndNonAsciiIncluded() {
    Invocation full = call(5, 1, HERON).run("orchard-survey-7").ref("plot-12:\"row\"\n3 \u00e9\ud83d\ude00").version(2)
        .dataVersion("sha256:0f1e").asOf("2031-05-17").cached(true).elapsedUs(1L << 40).outcome("domain_error")
        .idempotency("batch-7\u001f3", "sha256:abcd").build();
    Invocation bare = Invocation.builder(Fixtures.id(6, 0)).keyId(HERON).tool("nosuch").text("error: unknown_tool")
        .outcome("unknown_tool").build();
    for (Invocation inv : List.of(full, bare)) {
      ByteBuffer buf = ByteBuffer.allocate(Intake.encodedSize(inv));
      Intake.encode(inv, buf);
      buf.flip();
      assertEquals(inv, Intake.decode(buf));
      assertFalse(buf.hasRemaining());
    }
  }

  @Test
  void commit_isInTheIntakeLog_andEveryReadSeesIt() throws Exception {
    IntakeLedgerStore store = IntakeLedgerStore.open(dir, true);
    try {
      List<Invocation> batch = records(0, 3);
      store.append(batch);
      assertEquals(batch, Intake.read(folder()).records()); // on disk before the file has it, or after: both hold it
      assertEquals(batch, store.query(InvocationQuery.of(Scope.all())).invocations());
      assertEquals(0, store.recordsBehind());
    } finally {
      store.close();
    }
    assertEquals(List.of(), Intake.segments(folder())); // all in the file: the log is gone
  }

  /** Commits faster than the file takes them: an append past the limit waits for the mover, it does not fail. */
  @Test
  void append_pastTheLimitOfRecordsOnTheirWay_waitsForTheMover() throws Exception {
    IntakeLedgerStore store = IntakeLedgerStore.open(dir, false, Intake.SEGMENT_BYTES, java.time.Duration.ofSeconds(20), 2);
    List<Invocation> all = records(0, 200);
    try {
      for (Invocation r : all) {
        store.append(List.of(r)); // from the third on, each finds 2 on their way and waits
      }
      assertTrue(store.recordsBehind() <= 2, "at most the limit on their way: " + store.recordsBehind());
      assertEquals(all, store.query(InvocationQuery.of(Scope.all()).withLimit(1000)).invocations());
    } finally {
      store.close();
    }
  }

  /** A segment written as a crashed process leaves it: its records go into the file at the next open, once each. */
  @Test
  void open_afterACrash_movesTheLogIntoTheFile_andDeletesIt() throws Exception {
    IntakeLedgerStore.open(dir, true).close(); // the file exists, as after a first run
    List<Invocation> written = records(0, 50);
    try (Intake intake = Intake.open(folder(), true)) {
      intake.append(written.subList(0, 20));
      intake.append(written.subList(20, 50));
      intake.append(written.subList(10, 15)); // a group sent again after a failed write: still one record each
    }
    IntakeLedgerStore store = IntakeLedgerStore.open(dir, true);
    try {
      assertEquals(List.of(), Intake.read(folder()).records()); // moved, and the old segment deleted
      assertEquals(written, store.query(InvocationQuery.of(Scope.all()).withLimit(100)).invocations());
    } finally {
      store.close();
    }
  }

  /** A group whose write was cut short was never acknowledged: reading stops before it, and what precedes it is kept. */
  @Test
  void read_cutShortLastFrame_keepsTheWholeFramesBeforeIt() throws Exception {
    List<Invocation> written = records(0, 30);
    try (Intake intake = Intake.open(folder(), false)) {
      intake.append(written.subList(0, 10));
      intake.append(written.subList(10, 30));
    }
    Path segment = Intake.segments(folder()).get(0);
    long whole = Files.size(segment);
    for (long cut : new long[] {whole - 1, whole - 200, whole - 400}) {
      try (RandomAccessFile f = new RandomAccessFile(segment.toFile(), "rw")) {
        f.setLength(cut);
      }
      Intake.Contents contents = Intake.read(folder());
      assertEquals(written.subList(0, 10), contents.records(), "cut at " + cut);
      assertTrue(contents.unreadBytes() > 0);
    }
  }

  /** A damaged byte fails the frame's CRC-32C: reading that segment stops there, and later segments are still read. */
  @Test
  void read_damagedFrame_stopsThatSegment_laterSegmentsStillRead() throws Exception {
    List<Invocation> written = records(0, 30);
    try (Intake intake = Intake.open(folder(), false, 1)) { // a segment a group: every append starts a new one
      intake.append(written.subList(0, 10));
      intake.append(written.subList(10, 20));
      intake.append(written.subList(20, 30));
    }
    List<Path> segments = Intake.segments(folder());
    assertEquals(3, segments.size());
    try (RandomAccessFile f = new RandomAccessFile(segments.get(1).toFile(), "rw")) {
      f.seek(40);
      int b = f.read();
      f.seek(40);
      f.write(b ^ 0x20);
    }
    List<Invocation> expected = new ArrayList<>(written.subList(0, 10));
    expected.addAll(written.subList(20, 30));
    assertEquals(expected, Intake.read(folder()).records());
  }

  /** The frame layout, checked by hand: length, CRC-32C of the payload, payload starting with the count. */
  @Test
  void frame_layout_isLengthCrcThenCountedRecords() throws Exception {
    List<Invocation> one = records(0, 1);
    try (Intake intake = Intake.open(folder(), false)) {
      intake.append(one);
    }
    byte[] bytes = Files.readAllBytes(Intake.segments(folder()).get(0));
    ByteBuffer in = ByteBuffer.wrap(bytes);
    int length = in.getInt();
    int crc = in.getInt();
    assertEquals(bytes.length - 8, length);
    CRC32C check = new CRC32C();
    check.update(bytes, 8, length);
    assertEquals((int) check.getValue(), crc);
    assertEquals(1, in.getInt());
  }

  /** Segments fill and close; once the file holds their records they are deleted, while the store runs. */
  @Test
  void segments_rotateAndAreDeletedOnceMoved() throws Exception {
    IntakeLedgerStore store = IntakeLedgerStore.open(dir, true, 4096, java.time.Duration.ofSeconds(20));
    try {
      for (int i = 0; i < 40; i++) {
        store.append(records(i * 10, 10));
      }
      assertEquals(400, store.forEach(InvocationQuery.of(Scope.all()), inv -> {}));
      long deadline = System.nanoTime() + 10_000_000_000L;
      while (Intake.segments(folder()).size() > 1 && System.nanoTime() < deadline) {
        Thread.sleep(5);
      }
      assertEquals(1, Intake.segments(folder()).size()); // only the one being written
    } finally {
      store.close();
    }
  }

  /**
   * A record the file refuses (two ids with the same high half, which one generator never makes) does
   * not stop the others: it is kept in refused.jsonl and logged, and the rest of its group moves in.
   */
  @Test
  void recordTheFileRefuses_isKeptAside_andTheRestMoveIn() throws Exception {
    IntakeLedgerStore store = IntakeLedgerStore.open(dir, true);
    try {
      Invocation first = call(0, 0, HERON).build();
      store.append(List.of(first));
      UUID id = UUID.fromString(first.id());
      Invocation clash = Invocation.builder(new UUID(id.getMostSignificantBits(), id.getLeastSignificantBits() + 1).toString())
          .keyId(HERON).tool("arith").text("0.5").build();
      List<Invocation> group = new ArrayList<>(records(1, 5));
      group.add(2, clash);
      store.append(group);
      List<Invocation> expected = new ArrayList<>(List.of(first));
      expected.addAll(records(1, 5));
      assertEquals(expected, store.query(InvocationQuery.of(Scope.all())).invocations());
      assertEquals(1, store.recordsRefused());
      assertEquals(List.of(clash.toJson()), Files.readAllLines(folder().resolve(IntakeLedgerStore.REFUSED_FILE)));
      store.append(records(10, 1)); // the store goes on taking records
      assertEquals(7, store.forEach(InvocationQuery.of(Scope.all()), inv -> {}));
    } finally {
      store.close();
    }
  }

  /** Closing while the file refuses writes leaves the log for the next start, which moves it in. */
  @Test
  void close_whileTheFileIsFull_leavesTheLog_nextOpenMovesItIn() throws Exception {
    IntakeLedgerStore store = IntakeLedgerStore.open(dir, true, Intake.SEGMENT_BYTES, java.time.Duration.ofMillis(300));
    store.append(records(100, 1));
    store.forEach(InvocationQuery.of(Scope.all()), inv -> {});
    store.sqlite().limitPages(store.sqlite().pageCount());
    List<Invocation> big = new ArrayList<>();
    for (int i = 0; i < 5; i++) {
      big.add(call(200 + i, 0, HERON).text("x".repeat(20_000)).build()); // each needs pages of its own
    }
    store.append(big);
    Thread t = new Thread(store::close); // close keeps trying for a while; the test does not wait for all of it
    t.start();
    t.join(60_000);
    assertFalse(t.isAlive());
    assertFalse(Intake.read(folder()).records().isEmpty());
    IntakeLedgerStore again = IntakeLedgerStore.open(dir, true);
    try {
      assertEquals(6, again.forEach(InvocationQuery.of(Scope.all()), inv -> {}));
      assertEquals(List.of(), Intake.read(folder()).records());
    } finally {
      again.close();
    }
  }
}
