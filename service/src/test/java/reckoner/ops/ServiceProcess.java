package reckoner.ops;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStreamReader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/** The packaged jar ({@code reckoner serve ...}) as a process of its own, with its log lines kept. */
final class ServiceProcess implements AutoCloseable {
  private static final Pattern SERVING = Pattern.compile("serving \\d+ tool versions on http://[^:]+:(\\d+)");

  private final Process process;
  private final List<String> lines = new CopyOnWriteArrayList<>();
  private final int port;
  private final Thread reader;

  private ServiceProcess(Process process) throws InterruptedException {
    this.process = process;
    this.reader = new Thread(() -> {
      try (BufferedReader r = new BufferedReader(new InputStreamReader(process.getInputStream(), StandardCharsets.UTF_8))) {
        for (String line; (line = r.readLine()) != null; ) {
          lines.add(line);
        }
      } catch (IOException e) {
        // the process is gone
      }
    }, "service-log-reader");
    reader.setDaemon(true);
    reader.start();
    this.port = awaitPort();
  }

  /** The jar the build made (failsafe passes its path). */
  static Path jar() {
    Path jar = Path.of(System.getProperty("reckoner.jar", "target/reckoner.jar"));
    if (!Files.isRegularFile(jar)) {
      throw new AssertionError("no " + jar + ": run mvn package first (mvn verify does)");
    }
    return jar;
  }

  /** Starts {@code java -jar reckoner.jar serve ARGS} and waits until it listens. */
  static ServiceProcess serve(String... args) {
    return serve(java.util.Map.of(), args);
  }

  /** Starts {@code java -jar reckoner.jar serve ARGS} with more environment variables, and waits until it listens. */
  static ServiceProcess serve(java.util.Map<String, String> env, String... args) {
    List<String> command = new ArrayList<>(List.of(Path.of(System.getProperty("java.home"), "bin", "java").toString(),
        "-Xmx256m", "-XX:TieredStopAtLevel=1", "-jar", jar().toString(), "serve"));
    command.addAll(List.of(args));
    try {
      ProcessBuilder builder = new ProcessBuilder(command).redirectErrorStream(true);
      builder.environment().putAll(env);
      return new ServiceProcess(builder.start());
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw new IllegalStateException(e);
    }
  }

  private int awaitPort() throws InterruptedException {
    long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(60);
    while (System.nanoTime() < deadline) {
      for (String line : lines) {
        Matcher m = SERVING.matcher(line);
        if (m.find()) {
          return Integer.parseInt(m.group(1));
        }
      }
      if (!process.isAlive()) {
        throw new AssertionError("the service exited with " + process.exitValue() + ":\n" + String.join("\n", lines));
      }
      Thread.sleep(50);
    }
    process.destroyForcibly();
    throw new AssertionError("the service did not start in 60 s:\n" + String.join("\n", lines));
  }

  int port() {
    return port;
  }

  /** What it logged so far, one entry a line. */
  List<String> lines() {
    return List.copyOf(lines);
  }

  /** SIGTERM: the shutdown hook drains; returns the exit code. */
  int stop() throws InterruptedException {
    process.toHandle().destroy(); // Process.destroy would also close our end of its output, losing the last lines
    return await();
  }

  /** SIGKILL: no hook, no drain; returns the exit code. */
  int kill() throws InterruptedException {
    process.toHandle().destroyForcibly();
    return await();
  }

  private int await() throws InterruptedException {
    if (!process.waitFor(90, TimeUnit.SECONDS)) {
      process.destroyForcibly();
      throw new AssertionError("the service did not exit in 90 s");
    }
    reader.join(5_000); // the output ends with the process: the reader has the last lines then
    return process.exitValue();
  }

  boolean isAlive() {
    return process.isAlive();
  }

  @Override
  public void close() {
    if (process.isAlive()) {
      process.destroyForcibly();
    }
  }
}
