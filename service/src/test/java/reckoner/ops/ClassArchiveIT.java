package reckoner.ops;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.net.ServerSocket;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * ops/class-archive.sh, as the Dockerfile runs it: it writes a class-data archive for the jar, and
 * a JVM started with that archive (and -Xshare:on, which refuses to start if it cannot map it)
 * serves, with the service's own classes loaded from the archive.
 */
final class ClassArchiveIT {
  @TempDir Path dir;

  private static int freePort() throws IOException {
    try (ServerSocket s = new ServerSocket(0, 1, java.net.InetAddress.getLoopbackAddress())) {
      return s.getLocalPort();
    }
  }

  @Test
  void archive_isWritten_andAServiceStartedWithItLoadsItsClassesFromIt() throws Exception {
    Path jar = ServiceProcess.jar().toAbsolutePath();
    Path archive = dir.resolve("reckoner.jsa");
    ProcessBuilder write = new ProcessBuilder("bash", Repo.file("ops/class-archive.sh").toString(), jar.toString(),
        archive.toString()).redirectErrorStream(true).redirectOutput(dir.resolve("write.log").toFile());
    write.environment().put("CLASS_ARCHIVE_PORT", Integer.toString(freePort()));
    Process writer = write.start();
    assertTrue(writer.waitFor(180, TimeUnit.SECONDS), "the script did not end in 180 s");
    assertEquals(0, writer.exitValue(), Files.readString(dir.resolve("write.log")));
    assertTrue(Files.size(archive) > 1_000_000, "an archive of " + Files.size(archive) + " bytes");

    Path log = dir.resolve("serve.log");
    Process serve = new ProcessBuilder(Path.of(System.getProperty("java.home"), "bin", "java").toString(),
        "-Xshare:on", "-XX:SharedArchiveFile=" + archive, "-Xlog:class+load=info:file=" + dir.resolve("classes.log"),
        "-jar", jar.toString(), "serve", "--port", "0", "--data-dir", dir.resolve("data").toString())
        .redirectErrorStream(true).redirectOutput(log.toFile()).start();
    try {
      long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(60);
      while (!Files.readString(log).contains("serving ") && serve.isAlive() && System.nanoTime() < deadline) {
        Thread.sleep(50);
      }
      assertTrue(serve.isAlive() && Files.readString(log).contains("serving "), Files.readString(log));
      List<String> loads = Files.readAllLines(dir.resolve("classes.log"));
      assertTrue(loads.stream().anyMatch(l -> l.contains(" reckoner.Service ") && l.contains("shared objects file")),
          "reckoner.Service came from the archive");
      assertTrue(loads.stream().anyMatch(l -> l.contains(" io.javalin.Javalin ") && l.contains("shared objects file")),
          "Javalin came from the archive");
    } finally {
      serve.destroy();
      serve.waitFor(60, TimeUnit.SECONDS);
    }
  }
}
