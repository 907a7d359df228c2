package reckoner.tool;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Map;
import java.util.NavigableMap;
import java.util.Objects;
import java.util.Optional;
import java.util.TreeMap;

/**
 * The tools a service serves, several versions of one tool side by side. The newest version of a
 * name is its default. Immutable once built; thread-safe.
 */
public final class ToolRegistry {
  private final Map<String, NavigableMap<Integer, Tool>> byName;

  private ToolRegistry(Map<String, NavigableMap<Integer, Tool>> byName) {
    this.byName = byName;
  }

  /** A registry of {@code tools}; two tools with one id are a wiring error. */
  public static ToolRegistry of(List<? extends Tool> tools) {
    Map<String, NavigableMap<Integer, Tool>> byName = new TreeMap<>();
    for (Tool tool : tools) {
      ToolId id = Objects.requireNonNull(tool.id(), "id");
      Tool previous = byName.computeIfAbsent(id.name(), n -> new TreeMap<>()).putIfAbsent(id.version(), tool);
      if (previous != null) {
        throw new IllegalArgumentException("tool registered twice: " + id);
      }
    }
    byName.replaceAll((name, versions) -> Collections.unmodifiableNavigableMap(versions));
    return new ToolRegistry(Collections.unmodifiableMap(byName));
  }

  /** The tool with exactly this id, if served. */
  public Optional<Tool> find(ToolId id) {
    NavigableMap<Integer, Tool> versions = byName.get(id.name());
    return versions == null ? Optional.empty() : Optional.ofNullable(versions.get(id.version()));
  }

  /** The newest version of {@code name}, if any version is served. */
  public Optional<Tool> newest(String name) {
    NavigableMap<Integer, Tool> versions = byName.get(name);
    return versions == null ? Optional.empty() : Optional.of(versions.lastEntry().getValue());
  }

  /** Every tool served, by name and then version. */
  public List<Tool> all() {
    List<Tool> all = new ArrayList<>();
    byName.values().forEach(versions -> all.addAll(versions.values()));
    return Collections.unmodifiableList(all);
  }

  /** The versions served of {@code name}, ascending; empty if none. */
  public List<Integer> versions(String name) {
    NavigableMap<Integer, Tool> versions = byName.get(name);
    return versions == null ? List.of() : List.copyOf(versions.keySet());
  }
}
