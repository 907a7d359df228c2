package reckoner.ledger;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.channels.FileLock;
import java.nio.channels.OverlappingFileLockException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;

/**
 * The mark of the one process that writes a SQLite ledger: an OS file lock on a file beside it,
 * held from open to close and released by the OS if the process dies. The file holds the holder's
 * process id, for the message another process gets. SQLite's own locks serialise transactions; this
 * one keeps a second generator of ids away from the file (see {@link SqliteLedgerStore}).
 */
final class WriterLock implements AutoCloseable {
  private final FileChannel channel;
  private final FileLock lock;

  private WriterLock(FileChannel channel, FileLock lock) {
    this.channel = channel;
    this.lock = lock;
  }

  /** Takes the lock at {@code lockFile} for {@code ledger}, or fails with who holds it. */
  static WriterLock take(Path lockFile, Path ledger) {
    FileChannel channel;
    try {
      channel = FileChannel.open(lockFile, StandardOpenOption.CREATE, StandardOpenOption.READ, StandardOpenOption.WRITE);
    } catch (IOException e) {
      throw new UncheckedIOException("cannot open the ledger's lock file " + lockFile, e);
    }
    try {
      FileLock lock;
      try {
        lock = channel.tryLock();
      } catch (OverlappingFileLockException e) {
        lock = null; // held by this process, through another store
      }
      if (lock == null) {
        String holder = read(channel);
        channel.close();
        throw new IllegalStateException("the ledger " + ledger + " is being written by another process"
            + (holder.isEmpty() ? "" : " (pid " + holder + ")")
            + " or another store in this one; one process writes a SQLite ledger at a time (use PostgreSQL for several)");
      }
      channel.truncate(0);
      channel.write(ByteBuffer.wrap(Long.toString(ProcessHandle.current().pid()).getBytes(StandardCharsets.US_ASCII)), 0);
      return new WriterLock(channel, lock);
    } catch (IOException e) {
      try {
        channel.close();
      } catch (IOException ignored) {
        // Already failing; the first error is the one to report.
      }
      throw new UncheckedIOException("cannot lock the ledger's lock file " + lockFile, e);
    }
  }

  private static String read(FileChannel channel) throws IOException {
    ByteBuffer buf = ByteBuffer.allocate(32);
    channel.read(buf, 0);
    return new String(buf.array(), 0, buf.position(), StandardCharsets.US_ASCII).strip();
  }

  @Override
  public void close() {
    try {
      lock.release();
      channel.close();
    } catch (IOException ignored) {
      // Closing the channel releases the lock in any case.
    }
  }
}
