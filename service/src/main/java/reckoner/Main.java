package reckoner;

import java.nio.file.Path;
import java.time.Clock;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.concurrent.Callable;
import java.util.concurrent.CountDownLatch;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import reckoner.config.ConfigException;
import reckoner.config.ServiceConfig;

/** The command line: {@code reckoner serve [--port N] [--data-dir DIR] ...}. Wiring only. */
@Command(name = "reckoner", mixinStandardHelpOptions = true, version = "reckoner " + Service.VERSION,
    description = "Deterministic, versioned tools for language-model agents, served over HTTP.",
    subcommands = {Main.Serve.class})
public final class Main implements Runnable {
  public static void main(String[] args) {
    System.exit(new CommandLine(new Main()).execute(args));
  }

  @Override
  public void run() {
    new CommandLine(this).usage(System.out);
  }

  @Command(name = "serve", mixinStandardHelpOptions = true,
      description = "Start the HTTP service. Settings: flag > RECKONER_* environment > --config file > default.")
  static final class Serve implements Callable<Integer> {
    @Option(names = "--port", description = "TCP port (default 8080; 0 = any free port).")
    Integer port;

    @Option(names = "--host", description = "Address to listen on (default 127.0.0.1).")
    String host;

    @Option(names = "--data-dir", description = "Directory for the ledger and facts/ (default ./data).")
    Path dataDir;

    @Option(names = "--max-body-bytes", description = "Largest request body accepted (default 1048576).")
    Long maxBodyBytes;

    @Option(names = "--open-access", description = "Allow a non-loopback --host without API keys.")
    Boolean openAccess;

    @Option(names = "--max-batch-bytes", description = "Largest batch, splice or fill body and NDJSON line (default 16777216).")
    Long maxBatchBytes;

    @Option(names = "--cache-size", description = "Answers kept in the answer cache; 0 turns it off (default 100000).")
    Long cacheSize;

    @Option(names = "--call-threads", description = "Threads that run batch calls; 0 = one per core (default 0).")
    Integer callThreads;

    @Option(names = "--markup-open", description = "Splice markup: the string that opens a call (default <<).")
    String markupOpen;

    @Option(names = "--markup-separator", description = "Splice markup: the string before an answer (default ' => ').")
    String markupSeparator;

    @Option(names = "--markup-close", description = "Splice markup: the string that closes a call (default >>).")
    String markupClose;

    @Option(names = "--config", description = "A properties file of settings (same names as the flags, without --).")
    Path configFile;

    @Override
    public Integer call() throws InterruptedException {
      Map<String, String> flags = new LinkedHashMap<>();
      if (port != null) flags.put("port", port.toString());
      if (host != null) flags.put("host", host);
      if (dataDir != null) flags.put("data-dir", dataDir.toString());
      if (maxBodyBytes != null) flags.put("max-body-bytes", maxBodyBytes.toString());
      if (openAccess != null) flags.put("open-access", openAccess.toString());
      if (maxBatchBytes != null) flags.put("max-batch-bytes", maxBatchBytes.toString());
      if (cacheSize != null) flags.put("cache-size", cacheSize.toString());
      if (callThreads != null) flags.put("call-threads", callThreads.toString());
      if (markupOpen != null) flags.put("markup-open", markupOpen);
      if (markupSeparator != null) flags.put("markup-separator", markupSeparator);
      if (markupClose != null) flags.put("markup-close", markupClose);
      Path file = configFile != null ? configFile
          : System.getenv("RECKONER_CONFIG") != null ? Path.of(System.getenv("RECKONER_CONFIG")) : null;
      ServiceConfig config;
      try {
        config = ServiceConfig.from(ServiceConfig.merge(file, System.getenv(), flags));
      } catch (ConfigException e) {
        System.err.println("reckoner: " + e.getMessage());
        return 2;
      }
      Service service;
      try {
        service = Service.start(config, Clock.systemUTC());
      } catch (ConfigException e) {
        System.err.println("reckoner: " + e.getMessage());
        return 2;
      }
      CountDownLatch stopped = new CountDownLatch(1);
      Runtime.getRuntime().addShutdownHook(new Thread(() -> {
        service.close();
        stopped.countDown();
      }, "reckoner-shutdown"));
      stopped.await();
      return 0;
    }
  }
}
