package reckoner;

import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import reckoner.cli.FillCommand;
import reckoner.config.ConfigException;
import reckoner.config.ServiceConfig;
import reckoner.spec.Json;
import reckoner.splice.Filler;
import reckoner.splice.OnError;

/** The command line: {@code reckoner serve} and {@code reckoner fill}. Wiring only. */
@Command(name = "reckoner", mixinStandardHelpOptions = true, version = "reckoner " + Service.VERSION,
    description = "Deterministic, versioned tools for language-model agents.",
    subcommands = {Main.Serve.class, Main.Fill.class})
public final class Main implements Runnable {
  public static void main(String[] args) {
    int code = new CommandLine(new Main()).execute(args);
    Logs.flush(); // log lines are written by a queue's thread: write what it holds before exiting
    System.exit(code);
  }

  @Override
  public void run() {
    new CommandLine(this).usage(System.out);
  }

  /** Settings both commands share. Each maps to the setting of the same name (see ServiceConfig). */
  static final class Settings {
    @Option(names = "--data-dir", description = "Directory for the ledger and facts/ (default ./data).")
    Path dataDir;

    @Option(names = "--cache-size", description = "Answers kept in the answer cache; 0 turns it off (default 100000).")
    Long cacheSize;

    @Option(names = "--call-threads", description = "Threads that run calls in parallel; 0 = one per core (default 0).")
    Integer callThreads;

    @Option(names = "--markup-open", description = "Splice markup: the string that opens a call (default <<).")
    String markupOpen;

    @Option(names = "--markup-separator", description = "Splice markup: the string before an answer (default ' => ').")
    String markupSeparator;

    @Option(names = "--markup-close", description = "Splice markup: the string that closes a call (default >>).")
    String markupClose;

    @Option(names = "--facts-dir", description = "A directory of fact files (*.jsonl) beside <data dir>/facts; repeatable.")
    List<Path> factsDirs;

    @Option(names = "--facts-demo", negatable = true, description = "Serve the shipped demo fact sets (default true).")
    Boolean factsDemo;

    @Option(names = "--facts-default-set", description = "The fact set read when a call names none (default demo).")
    String factsDefaultSet;

    @Option(names = "--ledger", description = "Where invocations are kept: sqlite (default, <data dir>/ledger.db) or postgresql.")
    String ledger;

    @Option(names = "--ledger-url", description = "JDBC URL of the PostgreSQL ledger, e.g. jdbc:postgresql://127.0.0.1:5432/reckoner.")
    String ledgerUrl;

    @Option(names = "--durability", description = "commit (default: an answer leaves after its record is committed) or async.")
    String durability;

    @Option(names = "--config", description = "A properties file of settings (same names as the flags, without --).")
    Path configFile;

    final Map<String, String> flags = new LinkedHashMap<>();

    void put(String name, Object value) {
      if (value != null) {
        flags.put(name, value.toString());
      }
    }

    ServiceConfig resolve() {
      put("data-dir", dataDir);
      put("cache-size", cacheSize);
      put("call-threads", callThreads);
      put("markup-open", markupOpen);
      put("markup-separator", markupSeparator);
      put("markup-close", markupClose);
      if (factsDirs != null) {
        put("facts-dirs", String.join(",", factsDirs.stream().map(Path::toString).toList()));
      }
      put("facts-demo", factsDemo);
      put("ledger", ledger);
      put("ledger-url", ledgerUrl);
      put("durability", durability);
      put("facts-default-set", factsDefaultSet);
      Path file = configFile != null ? configFile
          : System.getenv("RECKONER_CONFIG") != null ? Path.of(System.getenv("RECKONER_CONFIG")) : null;
      return ServiceConfig.from(ServiceConfig.merge(file, System.getenv(), flags));
    }
  }

  @Command(name = "serve", mixinStandardHelpOptions = true,
      description = "Start the HTTP service. Settings: flag > RECKONER_* environment > --config file > default.")
  static final class Serve implements Callable<Integer> {
    @Mixin Settings settings;

    @Option(names = "--port", description = "TCP port (default 8080; 0 = any free port).")
    Integer port;

    @Option(names = "--host", description = "Address to listen on (default 127.0.0.1).")
    String host;

    @Option(names = "--max-body-bytes", description = "Largest request body accepted (default 1048576).")
    Long maxBodyBytes;

    @Option(names = "--max-batch-bytes", description = "Largest batch, splice or fill body and NDJSON line (default 16777216).")
    Long maxBatchBytes;

    @Option(names = "--open-access", description = "Allow a non-loopback --host without API keys.")
    Boolean openAccess;

    @Option(names = "--access-log", negatable = true, description = "Log every HTTP request as one line (default true).")
    Boolean accessLog;

    @Override
    public Integer call() throws InterruptedException {
      settings.put("port", port);
      settings.put("host", host);
      settings.put("max-body-bytes", maxBodyBytes);
      settings.put("max-batch-bytes", maxBatchBytes);
      settings.put("open-access", openAccess);
      settings.put("access-log", accessLog);
      Service service;
      try {
        service = Service.start(settings.resolve(), Clock.systemUTC());
      } catch (ConfigException e) {
        System.err.println("reckoner: " + e.getMessage());
        return 2;
      }
      CountDownLatch stopped = new CountDownLatch(1);
      Runtime.getRuntime().addShutdownHook(new Thread(() -> {
        service.close();
        Logs.flush(); // the drain's account is the last thing queued
        stopped.countDown();
      }, "reckoner-shutdown"));
      stopped.await();
      return 0;
    }
  }

  @Command(name = "fill", mixinStandardHelpOptions = true,
      description = {"Answer every call in a JSON Lines file of documents, offline, with the service's engine.",
          "Input lines: {\"id\": ..., \"document\": \"text with <<arith(1+1)>> calls\"}.",
          "Output lines, in input order: {\"id\", \"document\", \"calls\", \"malformed\"}."})
  static final class Fill implements Callable<Integer> {
    @Mixin Settings settings;

    @Option(names = {"-i", "--input"}, required = true, description = "The JSON Lines file of documents.")
    Path input;

    @Option(names = {"-o", "--output"}, required = true, description = "Where to write the filled documents.")
    Path output;

    @Option(names = "--run", description = "Run tag recorded with every call.")
    String run;

    @Option(names = "--on-error", defaultValue = "splice_error",
        description = "What a failed call leaves: splice_error (default), drop or keep.")
    String onError;

    @Option(names = "--progress", negatable = true, description = "Show a progress bar (default: when on a terminal).")
    Boolean progress;

    @Override
    public Integer call() throws Exception {
      OnError policy = OnError.parse(onError).orElse(null);
      if (policy == null) {
        System.err.println("reckoner: --on-error must be splice_error, drop or keep");
        return 2;
      }
      if (!Files.isRegularFile(input)) {
        System.err.println("reckoner: no such input file: " + input);
        return 2;
      }
      Engine engine;
      ServiceConfig config;
      try {
        config = settings.resolve();
        engine = Engine.build(config, Clock.systemUTC(), Json.newMapper(), reckoner.ledger.LedgerStats.CommitListener.none());
      } catch (ConfigException e) {
        System.err.println("reckoner: " + e.getMessage());
        return 2;
      }
      ExecutorService calls = Executors.newFixedThreadPool(Engine.callThreads(config), Service.daemonThreads("reckoner-fill-"));
      try {
        PrintStream err = new PrintStream(System.err, true, StandardCharsets.UTF_8);
        boolean show = progress != null ? progress : System.console() != null;
        FillCommand.Summary summary = new FillCommand(new Filler(engine.invoker()), Json.newMapper(), calls)
            .run(input, output, engine.markup(), policy, run, err, show);
        err.print(summary.describe());
        return summary.unrecordedDocuments() == 0 ? 0 : 1;
      } finally {
        calls.shutdown();
        engine.close(); // every record written before exit
      }
    }
  }
}
