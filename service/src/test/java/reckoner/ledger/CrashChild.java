package reckoner.ledger;

import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.time.Clock;
import java.util.concurrent.atomic.AtomicLong;
import reckoner.call.InvocationIds;

/**
 * The process {@link LedgerCrashTest} kills: writes records in commit mode from several threads
 * into the SQLite ledger in {@code args[0]} and prints {@code ack ID} for each one, only after its
 * commit completed — the moment the service would send the answer. Runs until killed.
 */
final class CrashChild {
  private CrashChild() {}

  public static void main(String[] args) throws Exception {
    PrintStream out = new PrintStream(new java.io.FileOutputStream(java.io.FileDescriptor.out), false, StandardCharsets.UTF_8);
    LedgerStore store = LedgerStore.sqlite(Path.of(args[0]));
    LedgerWriter writer = LedgerWriter.start(store);
    InvocationIds ids = new InvocationIds(Clock.systemUTC());
    AtomicLong n = new AtomicLong();
    for (int t = 0; t < 6; t++) {
      Thread caller = new Thread(() -> {
        while (true) {
          long i = n.incrementAndGet();
          Invocation inv = Invocation.builder(ids.next().toString()).keyId("key-heron").run("orchard-survey-7")
              .ref("plot-" + i / 40 + ":row-" + i % 40).tool("arith").version(1)
              .args("{\"expr\":\"" + i + "/4000\",\"places\":2,\"rounding\":\"half_even\"}").text("0.31").build();
          writer.append(inv).join();
          synchronized (out) {
            out.println("ack " + inv.id());
            out.flush();
          }
        }
      });
      caller.start();
    }
    synchronized (out) {
      out.println("ready");
      out.flush();
    }
    Thread.sleep(Long.MAX_VALUE);
  }
}
