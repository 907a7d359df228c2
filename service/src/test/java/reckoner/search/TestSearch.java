package reckoner.search;

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
import java.util.Optional;
import reckoner.data.DataLoadException;
import reckoner.data.DataSource;
import reckoner.data.ReloadListener;
import reckoner.tool.Arguments;
import reckoner.tool.CallContext;
import reckoner.tool.ToolException;

/** Shared fixtures: collection files in a temporary folder, stores over them, and one-line calls. */
final class TestSearch {
  static final CallContext CONTEXT = new CallContext(Clock.fixed(Instant.parse("2031-05-17T09:30:00Z"), ZoneOffset.UTC));

  private TestSearch() {}

  /** One document line of collection {@code c}. */
  static String doc(String c, String id, String title, String text) {
    return "{\"collection\":\"" + c + "\",\"id\":\"" + id + "\",\"title\":\"" + title + "\",\"text\":\"" + text + "\"}";
  }

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

  static SearchStore open(Path dir, String defaultCollection, SearchStore.Settings settings) {
    try {
      return SearchStore.open(List.of(DataSource.directory(dir)), defaultCollection, settings, ReloadListener.none());
    } catch (DataLoadException e) {
      throw new AssertionError(e.report().problems().toString(), e);
    }
  }

  static SearchStore inMemory(Path dir, String defaultCollection) {
    return open(dir, defaultCollection, SearchStore.Settings.inMemory());
  }

  /** Every collection on disk under {@code indexDir}, however small. */
  static SearchStore onDisk(Path dir, String defaultCollection, Path indexDir) {
    return open(dir, defaultCollection, new SearchStore.Settings(Optional.of(indexDir), 0));
  }

  /** The answer text, or {@code error: CODE} for a tool error. */
  static String answer(SearchTool tool, Arguments args) {
    try {
      return tool.invoke(tool.canonicalize(args), CONTEXT).text();
    } catch (ToolException e) {
      return "error: " + e.error().code().wireName();
    }
  }
}
