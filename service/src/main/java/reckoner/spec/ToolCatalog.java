package reckoner.spec;

import java.util.Collections;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.TreeMap;
import reckoner.tool.Tool;
import reckoner.tool.ToolId;
import reckoner.tool.ToolRegistry;

/**
 * The served tools together with their specs and compiled argument validators. Built once at
 * start: a tool without a valid spec stops the service there, not on its first call. Immutable.
 */
public final class ToolCatalog {
  private final ToolRegistry registry;
  private final Map<ToolId, Entry> entries;

  /** A served tool version: the tool, its spec, and the validator compiled from the spec. */
  public record Entry(Tool tool, ToolSpec spec, ArgumentValidator validator) {}

  private ToolCatalog(ToolRegistry registry, Map<ToolId, Entry> entries) {
    this.registry = registry;
    this.entries = entries;
  }

  public static ToolCatalog of(ToolRegistry registry, SpecLoader loader) {
    Map<ToolId, Entry> entries = new TreeMap<>();
    for (Tool tool : registry.all()) {
      ToolSpec spec = loader.load(tool.id());
      // Version 1 keeps the wording its refusals were published with; later versions say in words what is wrong.
      entries.put(tool.id(), new Entry(tool, spec, ArgumentValidator.of(spec, tool.id().version() >= 2)));
    }
    return new ToolCatalog(registry, Collections.unmodifiableMap(entries));
  }

  public Optional<Entry> find(ToolId id) {
    return Optional.ofNullable(entries.get(id));
  }

  /** The newest served version of {@code name}. */
  public Optional<Entry> newest(String name) {
    return registry.newest(name).map(t -> entries.get(t.id()));
  }

  public List<Integer> versions(String name) {
    return registry.versions(name);
  }

  /** Every served version, by name and then version. */
  public List<Entry> all() {
    return List.copyOf(entries.values());
  }
}
