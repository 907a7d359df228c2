package reckoner.search;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.time.LocalDate;
import java.time.format.DateTimeFormatter;
import java.time.format.DateTimeParseException;
import java.util.Comparator;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.TreeMap;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.apache.lucene.index.DirectoryReader;
import org.apache.lucene.store.ByteBuffersDirectory;
import org.apache.lucene.store.Directory;
import org.apache.lucene.store.MMapDirectory;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import reckoner.data.ContentDigest;
import reckoner.data.DataFiles;
import reckoner.data.DataFormat;
import reckoner.data.DataLine;
import reckoner.data.DataSource;
import reckoner.data.DataText;

/**
 * The collection file format: each non-blank line is one JSON object, a document ({@code
 * collection, id, title, text}, optional {@code url, date}) or a collection declaration ({@code
 * collection, options}; the one option is {@code language}). The first pass checks every line and
 * digests each collection without keeping its texts; {@link #assemble} then reuses what is served
 * or on disk for an unchanged digest, and otherwise reads the files a second time to index the
 * collections that changed, checking that the files still digest the same. One instance per
 * load; not thread-safe.
 */
final class SearchFormat implements DataFormat<Collection> {
  private static final Logger LOG = LoggerFactory.getLogger(SearchFormat.class);

  /** Collection names: lower-case ASCII letters, digits, {@code _} and {@code -}, at most 64. */
  static final Pattern NAME = Pattern.compile("[a-z0-9][a-z0-9_-]{0,63}");
  /** Longest line, in bytes of UTF-8: one document. */
  static final int MAX_LINE_BYTES = 4 * 1024 * 1024;
  static final int MAX_ID_LENGTH = 256;
  static final int MAX_TITLE_LENGTH = 300;
  static final int MAX_URL_LENGTH = 2048;
  /** The first field of every collection's digest: the file format and the passage and analysis rules' version. */
  static final String FORMAT = "reckoner-search/1";

  private static final Set<String> FIELDS = Set.of("collection", "id", "title", "text", "url", "date");
  private static final String FIELD_LIST = "collection, id, title, text, url, date";

  /** One document as read. */
  record Doc(String collection, String id, String title, String text, String url, LocalDate date) {}

  /** What the first pass learns of one collection. */
  private static final class Seen {
    final ContentDigest digest;
    final Map<String, String> ids = new HashMap<>(); // id -> "file:line" of its first document
    long textChars;

    Seen(String name) {
      this.digest = newDigest(name);
    }
  }

  private record Declaration(Language language, String file, int line) {}

  private final SearchStore.Settings settings;
  private final Map<String, Seen> seen = new TreeMap<>();
  private final Map<String, Declaration> declared = new HashMap<>();
  private final Map<String, String> redeclared = new LinkedHashMap<>(); // "file:line" -> collection

  SearchFormat(SearchStore.Settings settings) {
    this.settings = settings;
  }

  static ContentDigest newDigest(String name) {
    return ContentDigest.of(FORMAT).put(name);
  }

  /** Every field of a document, in a fixed order. */
  static void digest(ContentDigest digest, Doc doc) {
    digest.put(doc.id()).put(doc.title()).put(doc.text()).put(doc.url()).put(doc.date() == null ? null : doc.date().toString());
  }

  static String finish(ContentDigest digest, Language language) {
    return digest.put("language").put(language.tag()).version();
  }

  @Override
  public int maxLineBytes() {
    return MAX_LINE_BYTES;
  }

  @Override
  public boolean read(DataLine line) throws DataLine.Problem {
    Optional<Doc> doc = parse(line);
    if (doc.isEmpty()) {
      return false;
    }
    Doc d = doc.get();
    Seen s = seen.computeIfAbsent(d.collection(), Seen::new);
    String first = s.ids.putIfAbsent(d.id(), line.file() + ":" + line.number());
    if (first != null) {
      throw new DataLine.Problem("document id \"" + DataText.echo(d.id()) + "\" of collection \"" + d.collection()
          + "\" is already used at " + first);
    }
    digest(s.digest, d);
    s.textChars += d.title().length() + d.text().length();
    return true;
  }

  /** A document line as a document; a declaration is recorded and gives empty. */
  private Optional<Doc> parse(DataLine line) throws DataLine.Problem {
    String collection = name(line);
    if (line.members().containsKey("options")) {
      declare(line, collection);
      return Optional.empty();
    }
    for (String member : line.members().keySet()) {
      if (!FIELDS.contains(member)) {
        throw new DataLine.Problem("\"" + DataText.echo(member) + "\" is not a document field; the fields are " + FIELD_LIST);
      }
    }
    String id = string(line, "id", true);
    Optional<String> problem = TextChecks.idProblem(id, MAX_ID_LENGTH);
    if (problem.isPresent()) {
      throw new DataLine.Problem(problem.get());
    }
    String title = string(line, "title", true);
    problem = TextChecks.lineProblem("title", title, MAX_TITLE_LENGTH);
    if (problem.isPresent()) {
      throw new DataLine.Problem(problem.get());
    }
    String text = string(line, "text", true);
    problem = TextChecks.textProblem("text", text);
    if (problem.isPresent()) {
      throw new DataLine.Problem(problem.get());
    }
    String url = string(line, "url", false);
    if (url != null) {
      problem = TextChecks.urlProblem(url, MAX_URL_LENGTH);
      if (problem.isPresent()) {
        throw new DataLine.Problem(problem.get());
      }
    }
    return Optional.of(new Doc(collection, id, title, text, url, date(line)));
  }

  private void declare(DataLine line, String collection) throws DataLine.Problem {
    if (line.members().size() != 2) {
      throw new DataLine.Problem("a collection declaration holds only \"collection\" and \"options\"");
    }
    if (!(line.get("options") instanceof Map<?, ?> options)) {
      throw new DataLine.Problem("\"options\" must be an object");
    }
    for (Object option : options.keySet()) {
      if (!option.equals("language")) {
        throw new DataLine.Problem("unknown collection option \"" + DataText.echo(option.toString())
            + "\"; the options are language");
      }
    }
    Object tag = options.get("language");
    Language language = Language.DEFAULT;
    if (tag != null) {
      language = (tag instanceof String s ? Language.of(s) : Optional.<Language>empty())
          .orElseThrow(() -> new DataLine.Problem("option language must be one of " + Language.tags() + " but was "
              + DataLine.describe(tag)));
    }
    Declaration first = declared.putIfAbsent(collection, new Declaration(language, line.file(), line.number()));
    if (first != null) {
      throw new DataLine.Problem("options of collection \"" + collection + "\" are already declared at "
          + first.file() + ":" + first.line());
    }
  }

  private static String name(DataLine line) throws DataLine.Problem {
    Object name = line.get("collection");
    if (name == null) {
      throw new DataLine.Problem("\"collection\" is missing");
    }
    if (!(name instanceof String s) || !NAME.matcher(s).matches()) {
      throw new DataLine.Problem("\"collection\" must be a name of lower-case letters, digits, '_' and '-' (at most 64,"
          + " starting with a letter or digit) but was " + DataLine.describe(name));
    }
    return s;
  }

  private static String string(DataLine line, String field, boolean required) throws DataLine.Problem {
    Object v = line.get(field);
    if (v == null) {
      if (required) {
        throw new DataLine.Problem("\"" + field + "\" is missing");
      }
      return null;
    }
    if (!(v instanceof String s)) {
      throw new DataLine.Problem("\"" + field + "\" must be a string but was " + DataLine.describe(v));
    }
    return s;
  }

  private static LocalDate date(DataLine line) throws DataLine.Problem {
    Object v = line.get("date");
    if (v == null) {
      return null;
    }
    if (v instanceof String s && s.length() == 10) { // YYYY-MM-DD: years 0000 to 9999
      try {
        return LocalDate.parse(s, DateTimeFormatter.ISO_LOCAL_DATE);
      } catch (DateTimeParseException e) {
        // the message below
      }
    }
    throw new DataLine.Problem("\"date\" must be an ISO 8601 calendar date YYYY-MM-DD such as 2031-05-17 but was "
        + DataLine.describe(v));
  }

  /* ---------------- assembling: reuse, open or build ---------------- */

  @Override
  public Map<String, Collection> assemble(Assembly<Collection> assembly) {
    ProblemSink problems = assembly.problems();
    declared.forEach((name, d) -> {
      if (!seen.containsKey(name)) {
        problems.add(d.file(), d.line(), "collection \"" + name + "\" is declared but has no documents");
      }
    });
    Map<String, Collection> collections = new TreeMap<>();
    if (problems.count() > 0) {
      return collections; // nothing will be served: build nothing
    }
    Map<String, Builder> builds = new TreeMap<>();
    seen.forEach((name, s) -> {
      Language language = declared.containsKey(name) ? declared.get(name).language() : Language.DEFAULT;
      String version = finish(s.digest, language);
      Optional<Collection> served = assembly.previous().get(name).filter(c -> c.version().equals(version));
      if (served.isPresent()) {
        collections.put(name, served.get());
        return;
      }
      boolean onDisk = settings.indexDir().isPresent() && s.textChars > settings.memoryMaxChars();
      Path dir = onDisk ? indexPath(name, version) : null;
      if (onDisk && Files.isDirectory(dir)) {
        try {
          collections.put(name, openOnDisk(name, language, version, dir));
          return;
        } catch (IOException | RuntimeException e) {
          LOG.warn("the index of collection {} at {} cannot be opened ({}); building it again", name, dir, e.toString());
        }
      }
      builds.put(name, new Builder(name, language, version, dir));
    });
    if (!builds.isEmpty()) {
      build(builds, assembly, collections);
    }
    if (problems.count() == 0) {
      collections.forEach((name, c) -> removeStaleIndexes(name, c, assembly.previous().get(name)));
    }
    return collections;
  }

  /** A collection to index in the second pass. */
  private static final class Builder {
    final String name;
    final Language language;
    final String version;
    final Path target; // null: in memory
    Path work;
    Directory directory;
    IndexBuilder index;
    String failure;

    Builder(String name, Language language, String version, Path target) {
      this.name = name;
      this.language = language;
      this.version = version;
      this.target = target;
    }
  }

  private void build(Map<String, Builder> builds, Assembly<Collection> assembly, Map<String, Collection> collections) {
    ProblemSink problems = assembly.problems();
    for (Builder b : builds.values()) {
      try {
        if (b.target == null) {
          b.directory = new ByteBuffersDirectory();
        } else {
          Files.createDirectories(b.target.getParent());
          b.work = Files.createTempDirectory(b.target.getParent(), ".building-");
          b.directory = new MMapDirectory(b.work);
        }
        b.index = new IndexBuilder(b.name, b.language, b.directory);
      } catch (IOException e) {
        b.failure = "cannot create the index: " + e;
      }
    }
    for (DataSource.Input input : assembly.inputs()) {
      DataFiles.read(input, MAX_LINE_BYTES, line -> {
        Object name = line.get("collection");
        Builder b = name instanceof String s ? builds.get(s) : null;
        if (b == null || b.failure != null || line.members().containsKey("options")) {
          return;
        }
        Doc doc = parse(line).orElseThrow();
        try {
          b.index.add(doc);
        } catch (IOException | RuntimeException e) {
          b.failure = "cannot index document \"" + DataText.echo(doc.id()) + "\": " + e;
        }
      }, (line, reason) -> problems.add(input.name(), line, "on reading again to index: " + reason));
    }
    for (Builder b : builds.values()) {
      String where = b.target == null ? "collection " + b.name : b.target.toString();
      try {
        if (b.failure == null && !b.index.version(b.language).equals(b.version)) {
          b.failure = "the files changed while they were read; reload again";
        }
        if (b.failure == null && problems.count() == 0) {
          b.index.commit(b.version);
        }
        if (b.index != null) {
          b.index.close();
        }
        if (b.failure != null || problems.count() > 0) {
          discard(b);
          if (b.failure != null) {
            problems.add(where, 0, b.failure);
          }
          continue;
        }
        if (b.target != null) {
          b.directory.close();
          if (Files.exists(b.target)) {
            deleteTree(b.target); // an index of this version that could not be opened
          }
          Files.move(b.work, b.target, StandardCopyOption.ATOMIC_MOVE);
          collections.put(b.name, openOnDisk(b.name, b.language, b.version, b.target));
        } else {
          collections.put(b.name, new Collection(b.name, b.language, b.version, b.index.documents(), false,
              b.language.analyzer(), b.directory));
        }
      } catch (IOException | RuntimeException e) {
        discard(b);
        problems.add(where, 0, "cannot build the index: " + e);
      }
    }
  }

  private static Collection openOnDisk(String name, Language language, String version, Path dir) throws IOException {
    Directory directory = new MMapDirectory(dir);
    try {
      Map<String, String> data;
      try (DirectoryReader r = DirectoryReader.open(directory)) {
        data = r.getIndexCommit().getUserData();
      }
      if (!version.equals(data.get(IndexBuilder.VERSION_KEY))) {
        throw new IOException("it holds data version " + data.get(IndexBuilder.VERSION_KEY) + ", not " + version);
      }
      return new Collection(name, language, version, Integer.parseInt(data.get(IndexBuilder.DOCUMENTS_KEY)), true,
          language.analyzer(), directory);
    } catch (IOException | RuntimeException e) {
      directory.close();
      throw e;
    }
  }

  private Path indexPath(String name, String version) {
    return settings.indexDir().orElseThrow().resolve(name).resolve(version.replace("sha256:", ""));
  }

  private static void discard(Builder b) {
    try {
      if (b.directory != null) {
        b.directory.close();
      }
      if (b.work != null) {
        deleteTree(b.work);
      }
    } catch (IOException e) {
      LOG.warn("cannot remove the unfinished index {}: {}", b.work, e.toString());
    }
  }

  /** Deletes the other on-disk versions of a collection, keeping the one served until now. */
  private void removeStaleIndexes(String name, Collection now, Optional<Collection> before) {
    if (settings.indexDir().isEmpty()) {
      return;
    }
    Path parent = settings.indexDir().get().resolve(name);
    if (!Files.isDirectory(parent)) {
      return;
    }
    Set<String> keep = new java.util.HashSet<>();
    keep.add(now.version().replace("sha256:", ""));
    before.ifPresent(c -> keep.add(c.version().replace("sha256:", "")));
    try (Stream<Path> children = Files.list(parent)) {
      for (Path child : children.toList()) {
        String n = child.getFileName().toString();
        if (!keep.contains(n)) { // also what a stopped build left behind: one reload builds at a time
          deleteTree(child);
        }
      }
    } catch (IOException e) {
      LOG.warn("cannot remove old indexes of collection {}: {}", name, e.toString());
    }
  }

  private static void deleteTree(Path root) throws IOException {
    try (Stream<Path> all = Files.walk(root)) {
      for (Path p : all.sorted(Comparator.reverseOrder()).toList()) {
        Files.deleteIfExists(p);
      }
    }
  }
}
