package reckoner.call;

import com.github.benmanes.caffeine.cache.Cache;
import com.github.benmanes.caffeine.cache.Caffeine;
import java.util.Objects;
import java.util.Optional;
import reckoner.tool.Answer;
import reckoner.tool.Arguments;
import reckoner.tool.ToolId;

/**
 * Answers already computed, keyed by tool version, canonical arguments and the data version the
 * answer depends on (fact sets). Canonical arguments already hold the reference time ({@code
 * as_of}), so a different reference time is a different key; an answer that read the server clock
 * is never stored. Bounded by entry count; thread-safe.
 */
public final class AnswerCache {
  /** The cache key: equal for two spellings of one call, different after a data reload. */
  record Key(ToolId tool, Arguments canonical, String dataVersion) {
    Key {
      Objects.requireNonNull(tool, "tool");
      Objects.requireNonNull(canonical, "canonical");
    }
  }

  private final Cache<Key, Answer> cache;

  private AnswerCache(Cache<Key, Answer> cache) {
    this.cache = cache;
  }

  /** A cache of at most {@code maximumSize} answers; 0 disables caching. */
  public static AnswerCache ofMaximumSize(long maximumSize) {
    if (maximumSize < 0) {
      throw new IllegalArgumentException("maximum size must not be negative: " + maximumSize);
    }
    return new AnswerCache(Caffeine.newBuilder().maximumSize(maximumSize).recordStats().build());
  }

  /** The underlying Caffeine cache, for metrics binding only. */
  public Cache<?, ?> caffeine() {
    return cache;
  }

  Optional<Answer> get(Key key) {
    return Optional.ofNullable(cache.getIfPresent(key));
  }

  void put(Key key, Answer answer) {
    if (answer.cacheable()) {
      cache.put(key, answer);
    }
  }

  /** Drops every entry (used by tests and after administrative data changes). */
  public void clear() {
    cache.invalidateAll();
  }
}
