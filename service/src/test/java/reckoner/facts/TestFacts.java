package reckoner.facts;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.time.Clock;
import java.time.Instant;
import java.time.ZoneOffset;
import java.util.List;
import reckoner.call.CallRequest;
import reckoner.call.Invoker;
import reckoner.call.Outcome;
import reckoner.data.DataLoadException;
import reckoner.data.DataSource;
import reckoner.spec.Json;
import reckoner.spec.SpecLoader;
import reckoner.spec.ToolCatalog;
import reckoner.tool.ToolRegistry;
import tools.jackson.databind.json.JsonMapper;

/** Shared fixtures: fact files in a temporary folder, the demo store, and an Invoker over them. */
final class TestFacts {
  /** The fixed clock of every test (the same instant as the spec examples test). */
  static final Clock CLOCK = Clock.fixed(Instant.parse("2031-05-17T09:30:00Z"), ZoneOffset.UTC);
  static final JsonMapper JSON = Json.newMapper();

  private TestFacts() {}

  /** Writes {@code lines} as {@code dir/name}, atomically (written aside, then renamed into place). */
  static Path write(Path dir, String name, String... lines) {
    try {
      Path tmp = dir.resolve("." + name + ".tmp");
      Files.write(tmp, List.of(lines), StandardCharsets.UTF_8);
      return Files.move(tmp, dir.resolve(name), StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  static FactStore open(Path dir, String defaultSet) {
    try {
      return FactStore.open(List.of(DataSource.directory(dir)), defaultSet);
    } catch (DataLoadException e) {
      throw new AssertionError(e.report().problems().toString(), e);
    }
  }

  static FactStore demo() {
    try {
      return FactStore.open(List.of(FactStore.demo()), FactStore.DEMO_DEFAULT_SET);
    } catch (DataLoadException e) {
      throw new AssertionError(e.report().problems().toString(), e);
    }
  }

  static Invoker invoker(FactStore store) {
    ToolCatalog catalog = ToolCatalog.of(ToolRegistry.of(List.of(new FactsTool(store))), new SpecLoader(JSON));
    return new Invoker(catalog, CLOCK);
  }

  /** Runs {@code argsJson} as a facts@1 call. */
  static Outcome call(Invoker invoker, String argsJson) {
    return invoker.invoke(CallRequest.of("facts", 1, JSON.readTree(argsJson)));
  }
}
