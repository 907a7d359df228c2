package reckoner.tool;

/**
 * A small, deterministic function from arguments to one short line of text.
 *
 * <p>A call runs in two steps. {@link #canonicalize} turns the caller's arguments, structured or in
 * the free {@code text} form, into one canonical structured form with defaults filled in, so that
 * two spellings of one call give equal {@link Arguments}. {@link #invoke} then computes the answer
 * from canonical arguments only. Both report a caller's bad input as a {@link ToolException}.
 *
 * <p>The arguments have already passed the version's JSON Schema ({@code tool-specs/NAME/VERSION.json})
 * when either method sees them: unknown properties and wrong JSON types never reach a tool.
 * Implementations are immutable and thread-safe, read no hidden input (clock, locale, time zone),
 * and keep every call well under a millisecond through explicit limits on their input.
 */
public interface Tool {
  /** This tool's name and version. */
  ToolId id();

  /** Returns the canonical structured form of {@code args}; never contains {@link Arguments#TEXT}. */
  Arguments canonicalize(Arguments args) throws ToolException;

  /** Computes the answer to canonical arguments, as returned by {@link #canonicalize}. */
  Answer invoke(Arguments canonical, CallContext context) throws ToolException;

  /**
   * The version of the data that {@link #invoke} would answer {@code canonical} from, for tools
   * whose answers come from reloadable data (fact sets); empty for pure functions. The answer
   * cache keys on it, so a reload never serves a stale answer.
   */
  default java.util.Optional<String> dataVersion(Arguments canonical) {
    return java.util.Optional.empty();
  }

  /**
   * Loads what the first call would otherwise load (rule files, libraries that start slowly), so
   * that call is as fast as the rest. The service runs it once, off the request threads, after it
   * starts; by default nothing.
   */
  default void warmUp() {}
}
