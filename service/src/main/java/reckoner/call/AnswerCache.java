package reckoner.call;

import com.github.benmanes.caffeine.cache.Cache;
import com.github.benmanes.caffeine.cache.Caffeine;
import java.util.Objects;
import java.util.Optional;
import reckoner.tool.Answer;
import reckoner.tool.Arguments;
import reckoner.tool.ToolError;
import reckoner.tool.ToolId;

/**
 * Answers (and tool errors) already computed, keyed by tool version, canonical arguments and the data version the
 * answer depends on (fact sets). Canonical arguments already hold the reference time ({@code
 * as_of}), so a different reference time is a different key; an answer that read the server clock
 * is never stored. Bounded by entry count; thread-safe.
 */
public final class AnswerCache {
  /**
   * The cache key: equal for two spellings of one call, different after a data reload. The
   * arguments are held as their canonical JSON ({@link Arguments#toCanonicalJson()}, one string for
   * one value of {@link Arguments}, and made once for the ledger anyway), so a lookup compares two
   * strings rather than two maps.
   */
  record Key(ToolId tool, String canonical, String dataVersion) {
    Key {
      Objects.requireNonNull(tool, "tool");
      Objects.requireNonNull(canonical, "canonical");
    }

    Key(ToolId tool, Arguments canonical, String dataVersion) {
      this(tool, canonical.toCanonicalJson(), dataVersion);
    }
  }

  /** A cached result: the answer, or the error the tool gave (deterministic too). Exactly one is set. */
  record Result(Answer answer, ToolError error) {
    Result {
      if ((answer == null) == (error == null)) {
        throw new IllegalArgumentException("exactly one of answer or error");
      }
    }
  }

  private final Cache<Key, Result> cache;
  private final boolean enabled; // Caffeine's size 0 evicts later, not at once: 0 must mean off

  private AnswerCache(Cache<Key, Result> cache, boolean enabled) {
    this.cache = cache;
    this.enabled = enabled;
  }

  /** A cache of at most {@code maximumSize} answers; 0 disables caching. */
  public static AnswerCache ofMaximumSize(long maximumSize) {
    if (maximumSize < 0) {
      throw new IllegalArgumentException("maximum size must not be negative: " + maximumSize);
    }
    return new AnswerCache(Caffeine.newBuilder().maximumSize(maximumSize).recordStats().build(), maximumSize > 0);
  }

  /** The underlying Caffeine cache, for metrics binding only. */
  public Cache<?, ?> caffeine() {
    return cache;
  }

  Optional<Result> get(Key key) {
    return enabled ? Optional.ofNullable(cache.getIfPresent(key)) : Optional.empty();
  }

  void put(Key key, Answer answer) {
    if (enabled && answer.cacheable()) {
      cache.put(key, new Result(answer, null));
    }
  }

  /** Keeps a tool's error for canonical arguments: the same arguments always fail the same way. */
  void put(Key key, ToolError error) {
    if (enabled) {
      cache.put(key, new Result(null, error));
    }
  }

  /** Drops every entry (used by tests and after administrative data changes). */
  public void clear() {
    cache.invalidateAll();
  }
}
