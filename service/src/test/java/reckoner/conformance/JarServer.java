package reckoner.conformance;

import java.io.IOException;
import java.net.ServerSocket;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;

/**
 * The shipped jar, started as its own process on a free loopback port with a data dir of its own,
 * as a user would start it: {@code java -jar reckoner.jar serve --port N --data-dir DIR ...}.
 * Conformance tests talk to it over HTTP only. Its output goes to {@code target/conformance-logs/}.
 */
public final class JarServer implements AutoCloseable {
  private static final Path JAR = Path.of(System.getProperty("reckoner.jar", "service/target/reckoner.jar"));
  private static final Path LOGS = JAR.getParent().resolve("conformance-logs");
  private static JarServer shared;

  private final Process process;
  private final int port;
  private final Path dataDir;
  private final Path log;

  private JarServer(Process process, int port, Path dataDir, Path log) {
    this.process = process;
    this.port = port;
    this.dataDir = dataDir;
    this.log = log;
  }

  /** The jar being tested. */
  public static Path jar() {
    return JAR;
  }

  /** The project's root directory (README.md, tool-specs/). */
  public static Path projectDir() {
    return Path.of(System.getProperty("reckoner.project.dir", "."));
  }

  /**
   * A server on the embedded defaults, shared by the test classes that only read it or make calls
   * whose records they find by their own run tag. Stopped when the test JVM exits.
   */
  public static synchronized JarServer shared() {
    if (shared == null) {
      shared = start("shared", List.of(), Map.of());
      JarServer s = shared;
      Runtime.getRuntime().addShutdownHook(new Thread(s::close));
    }
    return shared;
  }

  /** Starts a server of its own with {@code args} after {@code serve --port N --data-dir DIR} and {@code env} added. */
  public static JarServer start(String name, List<String> args, Map<String, String> env) {
    try {
      return start(name, Files.createTempDirectory("reckoner-it-" + name), args, env);
    } catch (IOException e) {
      throw new IllegalStateException(e);
    }
  }

  /** Starts a server of its own on {@code dataDir}. */
  public static JarServer start(String name, Path dataDir, List<String> args, Map<String, String> env) {
    try {
      Files.createDirectories(LOGS);
      Path log = LOGS.resolve(name + ".log");
      for (int attempt = 0; attempt < 3; attempt++) {
        int port = freePort();
        List<String> command = new ArrayList<>(List.of(javaBin(), "-Xmx512m", "-jar", JAR.toString(), "serve",
            "--port", Integer.toString(port), "--data-dir", dataDir.toString()));
        command.addAll(args);
        ProcessBuilder pb = new ProcessBuilder(command).redirectErrorStream(true)
            .redirectOutput(ProcessBuilder.Redirect.to(log.toFile()));
        pb.environment().keySet().removeIf(k -> k.startsWith("RECKONER_"));
        pb.environment().putAll(env);
        Process p = pb.start();
        JarServer server = new JarServer(p, port, dataDir, log);
        if (server.awaitReady(Duration.ofSeconds(90))) {
          return server;
        }
        server.close();
        if (!Files.readString(log).contains("port is in use")) {
          break;
        }
      }
      throw new IllegalStateException("the jar did not become ready; its output is in " + log + ":\n" + tail(log));
    } catch (IOException e) {
      throw new IllegalStateException(e);
    }
  }

  /** Runs the jar as a command ({@code fill}, {@code --help}, ...) to its end; returns exit code and output. */
  public static Run run(Path workDir, List<String> args, Map<String, String> env, Duration timeout) {
    try {
      List<String> command = new ArrayList<>(List.of(javaBin(), "-Xmx512m", "-jar", JAR.toString()));
      command.addAll(args);
      ProcessBuilder pb = new ProcessBuilder(command).directory(workDir.toFile()).redirectErrorStream(true);
      pb.environment().keySet().removeIf(k -> k.startsWith("RECKONER_"));
      pb.environment().putAll(env);
      Process p = pb.start();
      byte[] out = p.getInputStream().readAllBytes();
      if (!p.waitFor(timeout.toMillis(), TimeUnit.MILLISECONDS)) {
        p.destroyForcibly();
        throw new IllegalStateException("the jar did not finish within " + timeout + ": " + args);
      }
      return new Run(p.exitValue(), new String(out, StandardCharsets.UTF_8));
    } catch (IOException e) {
      throw new IllegalStateException(e);
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw new IllegalStateException(e);
    }
  }

  /** A finished command: its exit code and its standard output and error, interleaved. */
  public record Run(int exitCode, String output) {}

  public int port() {
    return port;
  }

  /** {@code http://127.0.0.1:PORT} */
  public String base() {
    return "http://127.0.0.1:" + port;
  }

  public Path dataDir() {
    return dataDir;
  }

  /** Everything the process has printed so far. */
  public String output() {
    try {
      return Files.readString(log);
    } catch (IOException e) {
      return "";
    }
  }

  public boolean isAlive() {
    return process.isAlive();
  }

  public long pid() {
    return process.pid();
  }

  /** Sends SIGTERM and waits for the exit code (SIGKILL after 60 s). */
  public int stop() {
    process.destroy();
    try {
      if (!process.waitFor(60, TimeUnit.SECONDS)) {
        process.destroyForcibly().waitFor(10, TimeUnit.SECONDS);
      }
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
    }
    return process.isAlive() ? -1 : process.exitValue();
  }

  @Override
  public void close() {
    if (process.isAlive()) {
      stop();
    }
  }

  /** One request; the response as text. */
  public HttpResponse<String> send(String method, String path, Map<String, String> headers, byte[] body) {
    HttpRequest.Builder b = HttpRequest.newBuilder(URI.create(base() + path)).timeout(Duration.ofSeconds(60))
        .method(method, body == null ? HttpRequest.BodyPublishers.noBody() : HttpRequest.BodyPublishers.ofByteArray(body));
    new LinkedHashMap<>(headers).forEach(b::header);
    try {
      return CLIENT.send(b.build(), HttpResponse.BodyHandlers.ofString(StandardCharsets.UTF_8));
    } catch (IOException e) {
      throw new IllegalStateException(method + " " + path + ": " + e, e);
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw new IllegalStateException(e);
    }
  }

  /**
   * Sends {@code request} byte for byte on a new connection (a request the JDK's client would
   * refuse to send: raw header bytes, broken framing) and returns everything the server wrote back
   * before closing, decoded as ISO-8859-1 (so every byte survives).
   */
  public String raw(byte[] request) {
    try (java.net.Socket socket = new java.net.Socket(java.net.InetAddress.getLoopbackAddress(), port)) {
      socket.setSoTimeout(30_000);
      socket.getOutputStream().write(request);
      socket.getOutputStream().flush();
      socket.shutdownOutput();
      return new String(socket.getInputStream().readAllBytes(), StandardCharsets.ISO_8859_1);
    } catch (IOException e) {
      throw new IllegalStateException(e);
    }
  }

  public HttpResponse<String> get(String path) {
    return send("GET", path, Map.of(), null);
  }

  /** POST with a JSON body. */
  public HttpResponse<String> postJson(String path, String json, String... headers) {
    Map<String, String> h = new LinkedHashMap<>();
    h.put("Content-Type", "application/json");
    for (int i = 0; i + 1 < headers.length; i += 2) {
      h.put(headers[i], headers[i + 1]);
    }
    return send("POST", path, h, json.getBytes(StandardCharsets.UTF_8));
  }

  private static final HttpClient CLIENT = HttpClient.newBuilder().version(HttpClient.Version.HTTP_1_1)
      .connectTimeout(Duration.ofSeconds(10)).build();

  private boolean awaitReady(Duration timeout) {
    long deadline = System.nanoTime() + timeout.toNanos();
    while (System.nanoTime() < deadline) {
      if (!process.isAlive()) {
        return false;
      }
      try {
        HttpResponse<String> r = CLIENT.send(HttpRequest.newBuilder(URI.create(base() + "/health/ready"))
            .timeout(Duration.ofSeconds(5)).build(), HttpResponse.BodyHandlers.ofString());
        if (r.statusCode() == 200) {
          return true;
        }
      } catch (IOException e) {
        // not listening yet
      } catch (InterruptedException e) {
        Thread.currentThread().interrupt();
        return false;
      }
      try {
        Thread.sleep(100);
      } catch (InterruptedException e) {
        Thread.currentThread().interrupt();
        return false;
      }
    }
    return false;
  }

  private static int freePort() throws IOException {
    try (ServerSocket s = new ServerSocket(0, 1, java.net.InetAddress.getLoopbackAddress())) {
      return s.getLocalPort();
    }
  }

  private static String javaBin() {
    return Path.of(System.getProperty("java.home"), "bin", "java").toString();
  }

  private static String tail(Path log) throws IOException {
    List<String> lines = Files.readAllLines(log);
    return String.join("\n", lines.subList(Math.max(0, lines.size() - 30), lines.size()));
  }
}
