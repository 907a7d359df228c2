package reckoner;

import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.util.List;
import java.util.concurrent.Callable;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Spec;
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
    subcommands = {Main.Serve.class, Main.Fill.class, Main.Key.class, Main.AuditCommand.class})
public final class Main implements Runnable {
  public static void main(String[] args) {
    int code = commandLine().execute(args);
    Logs.flush(); // log lines are written by a queue's thread: write what it holds before exiting
    System.exit(code);
  }

  /** The command line with a flag for every setting (see {@link SettingFlags}). */
  static CommandLine commandLine() {
    CommandLine line = new CommandLine(new Main());
    SettingFlags.addTo(line.getSubcommands().get("serve").getCommandSpec(), true);
    SettingFlags.addTo(line.getSubcommands().get("fill").getCommandSpec(), false);
    SettingFlags.addTo(line.getSubcommands().get("audit").getCommandSpec(), false);
    return line;
  }

  @Override
  public void run() {
    commandLine().usage(System.out);
  }

  @Command(name = "serve", mixinStandardHelpOptions = true,
      description = "Start the HTTP service. Settings: flag > RECKONER_* environment > --config file > default.")
  static final class Serve implements Callable<Integer> {
    @Spec CommandSpec spec;

    @Option(names = "--config", description = "A properties file of settings (same names as the flags, without --).")
    Path configFile;

    @Override
    public Integer call() throws InterruptedException {
      Service service;
      try {
        service = Service.start(SettingFlags.resolve(spec, configFile, System.getenv()), Clock.systemUTC());
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
          "Input lines: {\"id\": ..., \"document\": \"text with <:arith(1+1):> calls\", \"as_of\": \"2024-06-12\"?}.",
          "Output lines, in input order: {\"id\", ...} and what POST /v1/fill answers for the document."})
  static final class Fill implements Callable<Integer> {
    @Spec CommandSpec spec;

    @Option(names = "--config", description = "A properties file of settings (same names as the flags, without --).")
    Path configFile;

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

    @Option(names = "--as-of", description = {"The reference time of every document without an as_of of its own",
        "(ISO 8601 date or date-time); without either, calls that need one read the clock."})
    String asOf;

    @Override
    public Integer call() throws Exception {
      OnError policy = OnError.parse(onError).orElse(null);
      if (policy == null) {
        System.err.println("reckoner: --on-error must be splice_error, drop or keep");
        return 2;
      }
      if (asOf != null && !FillCommand.isReferenceTime(asOf)) {
        System.err.println("reckoner: --as-of must be an ISO 8601 date or date-time, such as 2024-06-12 or 2024-06-12T09:30:00Z");
        return 2;
      }
      if (!Files.isRegularFile(input)) {
        System.err.println("reckoner: no such input file: " + input);
        return 2;
      }
      Engine engine;
      ServiceConfig config;
      try {
        config = SettingFlags.resolve(spec, configFile, System.getenv());
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
            .run(input, output, new FillCommand.Options(engine.markup(), policy, run, asOf), err, show);
        err.print(summary.describe());
        return summary.unrecordedDocuments() == 0 ? 0 : 1;
      } finally {
        calls.shutdown();
        engine.close(); // every record written before exit
      }
    }
  }

  @Command(name = "key", mixinStandardHelpOptions = true,
      description = {"Make a new API key: a random secret and the line for the keys file.",
          "The line goes to standard output (append it to the keys file); the secret goes to standard error,",
          "once: it is not stored anywhere, so give it to the key's owner now.",
          "Example: reckoner key --id team-a --scope invoke --scope ledger:read --rate 200 >> keys.jsonl"})
  static final class Key implements Callable<Integer> {
    @Option(names = "--id", required = true, description = "The key's id, as the ledger records it (letters, digits, . _ -).")
    String id;

    @Option(names = "--scope", required = true, description = "invoke, ledger:read or admin; repeatable.")
    List<String> scopes;

    @Option(names = "--rate", description = "Calls a second the key may make (default: no limit).")
    Double rate;

    @Override
    public Integer call() {
      java.util.Set<reckoner.access.Scope> set = java.util.EnumSet.noneOf(reckoner.access.Scope.class);
      for (String s : scopes) {
        java.util.Optional<reckoner.access.Scope> scope = reckoner.access.Scope.parse(s);
        if (scope.isEmpty()) {
          System.err.println("reckoner: unknown scope '" + s + "'; scopes are invoke, ledger:read, admin");
          return 2;
        }
        set.add(scope.get());
      }
      if (rate != null && !(rate > 0)) {
        System.err.println("reckoner: --rate must be a number of calls a second above 0");
        return 2;
      }
      reckoner.access.KeyMaker.NewKey key;
      try {
        key = reckoner.access.KeyMaker.make(id, set, rate == null ? 0 : rate, new java.security.SecureRandom(), Json.newMapper());
      } catch (IllegalArgumentException e) {
        System.err.println("reckoner: " + e.getMessage());
        return 2;
      }
      System.out.println(key.line());
      System.err.println("secret for key '" + id + "' (shown once, stored nowhere): " + key.secret());
      return 0;
    }
  }

  @Command(name = "audit", mixinStandardHelpOptions = true,
      description = {"Run recorded calls again on this build and report every answer that differs, byte for byte.",
          "Reads a ledger export (--input, NDJSON as GET /v1/invocations/export writes it) or the ledger the settings name",
          "(narrowed by --run, --tool, --since, --until, --key). Each call runs with the reference time it was recorded with;",
          "a call whose data version is no longer loaded is reported as not checkable, never as passing.",
          "Exit code: 0 when nothing differs, 1 when something does, 2 on a usage error."})
  static final class AuditCommand implements Callable<Integer> {
    @Spec CommandSpec spec;

    @Option(names = "--config", description = "A properties file of settings (same names as the flags, without --).")
    Path configFile;

    @Option(names = "--input", description = "A ledger export (NDJSON); without it, the ledger the settings name.")
    Path input;

    @Option(names = "--output", description = "Where to write the report (JSON); default: standard output.")
    Path output;

    @Option(names = "--run", description = "Only this run's records (ledger only).")
    String run;

    @Option(names = "--tool", description = "Only this tool's records (ledger only).")
    String tool;

    @Option(names = "--since", description = "Only records at or after this ISO 8601 instant (ledger only).")
    String since;

    @Option(names = "--until", description = "Only records before this ISO 8601 instant (ledger only).")
    String until;

    @Option(names = "--key", description = "Only this API key's records (ledger only).")
    String key;

    @Override
    public Integer call() throws Exception {
      ServiceConfig config;
      try {
        config = SettingFlags.resolve(spec, configFile, System.getenv());
      } catch (ConfigException e) {
        System.err.println("reckoner: " + e.getMessage());
        return 2;
      }
      tools.jackson.databind.json.JsonMapper json = Json.newMapper();
      reckoner.audit.Audit audit;
      PrintStream err = new PrintStream(System.err, true, StandardCharsets.UTF_8);
      if (input != null) {
        if (!Files.isRegularFile(input)) {
          err.println("reckoner: no such input file: " + input);
          return 2;
        }
        audit = new reckoner.audit.Audit(Engine.catalogOnly(config, json), json);
        try (java.io.BufferedReader r = Files.newBufferedReader(input, StandardCharsets.UTF_8)) {
          for (String line; (line = r.readLine()) != null; ) {
            if (!line.isBlank()) {
              audit.check(reckoner.audit.AuditReports.fromExportLine(line, json));
            }
          }
        }
      } else {
        audit = new reckoner.audit.Audit(Engine.catalogOnly(config, json), json);
        java.util.Map<String, java.util.List<String>> params = new java.util.LinkedHashMap<>();
        putParam(params, "run", run);
        putParam(params, "tool", tool);
        putParam(params, "since", since);
        putParam(params, "until", until);
        reckoner.ledger.InvocationQuery query;
        try {
          query = reckoner.ledger.InvocationQuery.fromParameters(key == null ? reckoner.ledger.InvocationQuery.Scope.all()
              : reckoner.ledger.InvocationQuery.Scope.key(key), params);
        } catch (reckoner.tool.ToolException e) {
          err.println("reckoner: " + e.error().detail());
          return 2;
        }
        try (reckoner.ledger.LedgerStore store = Engine.openLedger(config)) {
          reckoner.audit.Audit a = audit;
          store.forEach(query, a::check);
        } catch (ConfigException e) {
          err.println("reckoner: " + e.getMessage());
          return 2;
        }
      }
      tools.jackson.databind.node.ObjectNode report = reckoner.audit.AuditReports.toJson(audit.report(), Service.VERSION, json);
      if (output == null) {
        System.out.println(json.writeValueAsString(report));
      } else {
        Files.writeString(output, json.writeValueAsString(report) + "\n", StandardCharsets.UTF_8);
      }
      reckoner.audit.Audit.Report r = audit.report();
      err.printf(java.util.Locale.ROOT, "audited %d records: %d the same, %d different, %d not checkable%n", r.records(), r.same(),
          r.different(), r.notCheckable());
      return r.different() == 0 ? 0 : 1;
    }

    private static void putParam(java.util.Map<String, java.util.List<String>> params, String name, String value) {
      if (value != null) {
        params.put(name, java.util.List.of(value));
      }
    }
  }
}
