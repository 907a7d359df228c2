package reckoner.facts;

import java.io.IOException;
import java.io.InputStream;
import java.nio.ByteBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CharsetDecoder;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.time.LocalDate;
import java.time.format.DateTimeFormatter;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.regex.Pattern;

/**
 * Reads one fact file, line by line, into raw facts and set declarations, collecting every
 * problem with its line. Each non-blank line is one JSON object: a fact
 * ({@code set, key, value}, optional {@code aliases, valid_from, valid_to, source}) or a set
 * declaration ({@code set, options}). Stateless; thread-safe.
 */
final class FactFileReader {
  /** Set names: lower-case ASCII letters, digits, {@code _} and {@code -}, at most 64. */
  static final Pattern SET_NAME = Pattern.compile("[a-z0-9][a-z0-9_-]{0,63}");
  /** Longest line, in bytes of UTF-8. */
  static final int MAX_LINE_BYTES = 65_536;
  static final int MAX_ALIASES = 32;
  /** Problems listed per file; more are counted in one last line. */
  static final int MAX_PROBLEMS_SHOWN = 10;

  private static final Set<String> FACT_FIELDS =
      Set.of("set", "key", "value", "aliases", "valid_from", "valid_to", "source");
  private static final String FACT_FIELD_LIST = "set, key, value, aliases, valid_from, valid_to, source";
  private static final Set<String> OPTIONS = Set.of("fold_accents");

  /** A fact as read, before its set is indexed. */
  record RawFact(String set, String key, String value, List<String> aliases, LocalDate from, LocalDate to,
      String source, String file, int line) {}

  /** A set's options, as declared by a {@code {"set":..., "options":{...}}} line. */
  record Declaration(String set, boolean foldAccents, String file, int line) {}

  /** What one file held. */
  record FileRead(String file, List<RawFact> facts, List<Declaration> declarations, Problems problems) {}

  /** A bounded list of one file's problems. */
  static final class Problems {
    private final String file;
    private final List<ReloadReport.Problem> shown = new ArrayList<>();
    private int count;

    Problems(String file) {
      this.file = file;
    }

    void add(int line, String reason) {
      count++;
      if (shown.size() < MAX_PROBLEMS_SHOWN) {
        shown.add(new ReloadReport.Problem(file, line, reason));
      }
    }

    boolean isEmpty() {
      return count == 0;
    }

    List<ReloadReport.Problem> list() {
      List<ReloadReport.Problem> all = new ArrayList<>(shown);
      if (count > shown.size()) {
        all.add(new ReloadReport.Problem(file, 0, (count - shown.size()) + " more problems not shown"));
      }
      return all;
    }
  }

  /** A line's problem, thrown inside the reader and caught per line. */
  private static final class LineProblem extends Exception {
    private static final long serialVersionUID = 1L;

    LineProblem(String reason) {
      super(reason, null, false, false);
    }
  }

  private FactFileReader() {}

  /** Repeated strings of one file (set names, sources, dates) shared instead of kept once per line. */
  private static final class Shared {
    private static final int MAX_ENTRIES = 4096;
    private final Map<String, String> strings = new java.util.HashMap<>();
    private final Map<String, LocalDate> dates = new java.util.HashMap<>();

    String string(String s) {
      if (s == null) {
        return null;
      }
      String shared = strings.get(s);
      if (shared != null) {
        return shared;
      }
      if (strings.size() < MAX_ENTRIES) {
        strings.put(s, s);
      }
      return s;
    }

    LocalDate date(String s) throws DateTimeParseException {
      LocalDate d = dates.get(s);
      if (d == null) {
        d = LocalDate.parse(s, DateTimeFormatter.ISO_LOCAL_DATE);
        if (dates.size() < MAX_ENTRIES) {
          dates.put(s, d);
        }
      }
      return d;
    }
  }

  static FileRead read(FactSource.Input input) {
    String file = input.name();
    Shared shared = new Shared();
    List<RawFact> facts = new ArrayList<>();
    List<Declaration> declarations = new ArrayList<>();
    Problems problems = new Problems(file);
    CharsetDecoder utf8 = StandardCharsets.UTF_8.newDecoder()
        .onMalformedInput(CodingErrorAction.REPORT)
        .onUnmappableCharacter(CodingErrorAction.REPORT);
    try (InputStream in = input.open()) {
      LineBytes bytes = new LineBytes(in);
      int lineNumber = 0;
      while (bytes.next()) {
        lineNumber++;
        if (bytes.tooLong) {
          problems.add(lineNumber, "line is longer than " + MAX_LINE_BYTES + " bytes");
          continue;
        }
        String line;
        try {
          line = utf8.decode(ByteBuffer.wrap(bytes.buffer, 0, bytes.length)).toString();
        } catch (CharacterCodingException e) {
          problems.add(lineNumber, "not valid UTF-8");
          continue;
        }
        if (lineNumber == 1 && line.startsWith("\uFEFF")) {
          line = line.substring(1); // a byte order mark some editors write
        }
        if (line.isBlank()) {
          continue;
        }
        try {
          readLine(line, file, lineNumber, facts, declarations, shared);
        } catch (LineProblem e) {
          problems.add(lineNumber, e.getMessage());
        }
      }
    } catch (IOException e) {
      problems.add(0, "cannot read: " + e.getMessage());
    }
    return new FileRead(file, facts, declarations, problems);
  }

  /** The bytes of one line at a time, split at LF with a CR before it dropped; buffers reused between lines. */
  private static final class LineBytes {
    private final InputStream in;
    private final byte[] chunk = new byte[1 << 16];
    private int chunkPos;
    private int chunkEnd;
    byte[] buffer = new byte[256];
    int length;
    boolean tooLong;

    LineBytes(InputStream in) {
      this.in = in;
    }

    /** Reads the next line; false at the end of the input. */
    boolean next() throws IOException {
      length = 0;
      tooLong = false;
      boolean any = false;
      while (true) {
        if (chunkPos == chunkEnd) {
          chunkEnd = in.read(chunk, 0, chunk.length);
          chunkPos = 0;
          if (chunkEnd <= 0) {
            chunkEnd = 0;
            return any && trimCr();
          }
        }
        any = true;
        int start = chunkPos;
        while (chunkPos < chunkEnd && chunk[chunkPos] != '\n') {
          chunkPos++;
        }
        append(start, chunkPos);
        if (chunkPos < chunkEnd) {
          chunkPos++; // the LF
          return trimCr();
        }
      }
    }

    private void append(int from, int to) {
      int n = Math.min(to - from, MAX_LINE_BYTES - length);
      if (n < to - from) {
        tooLong = true;
      }
      if (length + n > buffer.length) {
        buffer = java.util.Arrays.copyOf(buffer, Math.max(length + n, Math.min(buffer.length * 2, MAX_LINE_BYTES)));
      }
      System.arraycopy(chunk, from, buffer, length, n);
      length += n;
    }

    private boolean trimCr() {
      if (length > 0 && buffer[length - 1] == '\r') {
        length--;
      }
      return true;
    }
  }

  private static void readLine(String line, String file, int lineNumber, List<RawFact> facts,
      List<Declaration> declarations, Shared shared) throws LineProblem {
    Map<String, Object> object;
    try {
      object = JsonLine.parseObject(line);
    } catch (JsonLine.Malformed e) {
      throw new LineProblem("not a JSON object at column " + e.column() + ": " + e.getMessage());
    }
    String set = shared.string(setName(object));
    if (object.containsKey("options")) {
      declarations.add(declaration(object, set, file, lineNumber));
      return;
    }
    for (String member : object.keySet()) {
      if (!FACT_FIELDS.contains(member)) {
        throw new LineProblem("\"" + TextRules.echo(member) + "\" is not a fact field; the fields are " + FACT_FIELD_LIST);
      }
    }
    String key = stored(object, "key", TextRules.MAX_KEY_LENGTH, true);
    String value = stored(object, "value", TextRules.MAX_VALUE_LENGTH, true);
    List<String> aliases = aliases(object);
    LocalDate from = date(object, "valid_from", shared);
    LocalDate to = date(object, "valid_to", shared);
    if (from != null && to != null && !from.isBefore(to)) {
      throw new LineProblem("valid_from " + from + " must be before valid_to " + to
          + " (the interval is half-open: valid_to is the first day it no longer holds)");
    }
    String source = shared.string(stored(object, "source", TextRules.MAX_SOURCE_LENGTH, false));
    facts.add(new RawFact(set, key, value, aliases, from, to, source, file, lineNumber));
  }

  private static String setName(Map<String, Object> object) throws LineProblem {
    Object set = object.get("set");
    if (set == null) {
      throw new LineProblem("\"set\" is missing");
    }
    if (!(set instanceof String s) || !SET_NAME.matcher(s).matches()) {
      throw new LineProblem("\"set\" must be a name of lower-case letters, digits, '_' and '-' (at most 64,"
          + " starting with a letter or digit) but was " + describe(set));
    }
    return s;
  }

  private static Declaration declaration(Map<String, Object> object, String set, String file, int line)
      throws LineProblem {
    if (object.size() != 2) {
      throw new LineProblem("a set declaration holds only \"set\" and \"options\"");
    }
    if (!(object.get("options") instanceof Map<?, ?> options)) {
      throw new LineProblem("\"options\" must be an object");
    }
    for (Object name : options.keySet()) {
      if (!OPTIONS.contains(name)) {
        throw new LineProblem("unknown set option \"" + TextRules.echo(name.toString()) + "\"; the options are fold_accents");
      }
    }
    Object fold = options.get("fold_accents");
    if (fold != null && !(fold instanceof Boolean)) {
      throw new LineProblem("option fold_accents must be true or false but was " + describe(fold));
    }
    return new Declaration(set, Boolean.TRUE.equals(fold), file, line);
  }

  private static String stored(Map<String, Object> object, String field, int maxLength, boolean required)
      throws LineProblem {
    Object v = object.get(field);
    if (v == null) {
      if (required) {
        throw new LineProblem("\"" + field + "\" is missing");
      }
      return null;
    }
    if (!(v instanceof String s)) {
      throw new LineProblem("\"" + field + "\" must be a string but was " + describe(v));
    }
    Optional<String> problem = TextRules.storedTextProblem(field, s, maxLength);
    if (problem.isPresent()) {
      throw new LineProblem(problem.get());
    }
    return s;
  }

  private static List<String> aliases(Map<String, Object> object) throws LineProblem {
    Object v = object.get("aliases");
    if (v == null) {
      return List.of();
    }
    if (!(v instanceof List<?> list)) {
      throw new LineProblem("\"aliases\" must be an array of strings but was " + describe(v));
    }
    if (list.size() > MAX_ALIASES) {
      throw new LineProblem("a fact may have at most " + MAX_ALIASES + " aliases but this one has " + list.size());
    }
    List<String> aliases = new ArrayList<>(list.size());
    for (Object a : list) {
      if (!(a instanceof String s)) {
        throw new LineProblem("every alias must be a string but one was " + describe(a));
      }
      Optional<String> problem = TextRules.storedTextProblem("alias", s, TextRules.MAX_KEY_LENGTH);
      if (problem.isPresent()) {
        throw new LineProblem(problem.get());
      }
      aliases.add(s);
    }
    return List.copyOf(aliases);
  }

  private static LocalDate date(Map<String, Object> object, String field, Shared shared) throws LineProblem {
    Object v = object.get(field);
    if (v == null) {
      return null;
    }
    if (v instanceof String s) {
      try {
        return shared.date(s);
      } catch (DateTimeParseException e) {
        // fall through to the message below
      }
    }
    throw new LineProblem("\"" + field + "\" must be an ISO 8601 calendar date such as 2031-05-17 but was " + describe(v));
  }

  private static String describe(Object v) {
    if (v instanceof String s) {
      return "\"" + TextRules.echo(s) + "\"";
    }
    if (v instanceof Map) {
      return "an object";
    }
    if (v instanceof List) {
      return "an array";
    }
    return String.valueOf(v);
  }
}
