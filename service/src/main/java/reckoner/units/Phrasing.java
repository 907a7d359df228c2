package reckoner.units;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import reckoner.tool.ErrorCode;
import reckoner.tool.ResultText;
import reckoner.tool.ToolError;
import reckoner.tool.ToolException;

/**
 * Reads the free-text form of {@code units@2} as models and people write it:
 *
 * <pre>
 * [convert | what is | what's | how much is | please ...] QUANTITY [from] SEPARATOR TARGET [?]
 *   SEPARATOR := to | into | in | in terms of | as | -> | → | = | = ? | is how many | equals how many ...
 * how many TARGET (in | are in | are there in | is | are | make | makes | equal | equals) QUANTITY [?]
 * </pre>
 *
 * such as {@code 3 cups to ml}, {@code 5 ft 11 in to cm}, {@code 10 kg -> lb}, {@code 5 km = ? mi},
 * {@code what is 98.6 F in C?}, {@code convert 100 from celsius to fahrenheit},
 * {@code how many feet in a mile}. Keywords are matched in any case. Where a separator word
 * occurs more than once ({@code 12 in in cm}), each split is tried: one whose units convert is
 * preferred to one whose units only read, an explicit separator ({@code ->}, {@code =}) to
 * {@code to}, and {@code to} to {@code in} and {@code as}; two equally good splits are refused
 * as ambiguous. Pure functions of the text and the probe.
 */
final class Phrasing {
  static final int MAX_TEXT = 1000;
  /** At most this many ways to split one text are tried; a real phrase has one to three. */
  static final int MAX_SPLITS = 16;

  /** The quantity and the target of a text, the target's parts as written (cleaned). */
  record Call(Quantity quantity, List<String> to) {}

  /** Checks a split: null when its units read and convert, else the error they give. */
  interface Probe extends Quantity.UnitProbe {
    ToolException check(Quantity quantity, List<String> to);
  }

  private static final List<String> LEADING = List.of("please ", "can you ", "could you ", "convert ", "what is ",
      "what's ", "whats ", "what are ", "how much is ", "how much are ", "express ", "change ", "calculate ",
      "tell me ");

  /** Separators in groups of falling preference; within a group, longer first. */
  private static final List<List<String[]>> SEPARATORS = List.of(
      words("= how many", "= how much", "= ?", "is how many", "are how many", "equals how many", "equal how many",
          "in how many", "to how many", "is how much", "equals ?", "->", "="),
      words("into", "to"),
      words("in terms of", "in", "as"));

  /** The words between the target and the quantity of a question, in falling preference. */
  private static final List<String[]> QUESTION = words("are there in", "is there in", "are in", "is in", "go into",
      "fit in", "fit into", "in a", "in an", "in", "make up", "make", "makes", "equal", "equals", "is", "are");

  private Phrasing() {}

  private static List<String[]> words(String... phrases) {
    return Arrays.stream(phrases).map(p -> p.split(" ")).toList();
  }

  /** Reads {@code text}; {@code table} cleans units, {@code probe} scores the possible splits. */
  static Call parse(String text, UnitTable table, Probe probe) throws ToolException {
    String s = UnitText.prepare(text);
    if (s.length() > MAX_TEXT) {
      throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "the text may have at most " + MAX_TEXT
          + " characters but has " + s.length());
    }
    s = stripEnd(s);
    s = spaceArrows(s);
    String lower = s.toLowerCase(Locale.ROOT);
    boolean stripped = true;
    while (stripped) {
      stripped = false;
      for (String lead : LEADING) {
        if (lower.startsWith(lead)) {
          s = s.substring(lead.length()).strip();
          lower = lower.substring(lead.length()).strip();
          stripped = true;
        }
      }
    }
    if (lower.startsWith("how many ") || lower.startsWith("how much ")) {
      return question(s.substring("how many ".length()).strip(), table, probe);
    }
    Amounts.Amount amount = Amounts.read(s, 0);
    if (amount == null) {
      throw new ToolException(ErrorCode.SYNTAX_ERROR, "the text must start with the number to convert, as in"
          + " '3.5 km to mi' or 'how many feet in a mile'");
    }
    String rest = s.substring(amount.end());
    boolean glued = !rest.startsWith(" ");
    List<String> tokens = tokens(rest);
    if (!tokens.isEmpty() && tokens.get(0).equalsIgnoreCase("from")) {
      tokens = tokens.subList(1, tokens.size()); // convert 100 from celsius to fahrenheit
      glued = false;
    }
    List<Candidate> candidates = new ArrayList<>();
    for (int g = 0; g < SEPARATORS.size(); g++) {
      for (int i = 1; i < tokens.size(); i++) {
        for (String[] sep : SEPARATORS.get(g)) {
          if (matches(tokens, i, sep) && i + sep.length < tokens.size()) {
            String source = (glued ? "" : " ") + String.join(" ", tokens.subList(0, i));
            requireFewSplits(candidates);
            candidates.add(candidate(g, () -> Quantity.parse(amount.value(), source, table, probe),
                String.join(" ", tokens.subList(i + sep.length, tokens.size())), table, probe));
            break;
          }
        }
      }
    }
    if (candidates.isEmpty()) {
      throw new ToolException(ErrorCode.SYNTAX_ERROR, "expected 'to' between the quantity and the unit to convert to,"
          + " as in '3.5 km to mi'");
    }
    return choose(candidates);
  }

  /** {@code how many TARGET in QUANTITY}: the words after {@code how many}. */
  private static Call question(String s, UnitTable table, Probe probe) throws ToolException {
    List<String> tokens = tokens(s);
    List<Candidate> candidates = new ArrayList<>();
    for (int c = 0; c < QUESTION.size(); c++) {
      String[] connector = QUESTION.get(c);
      boolean article = connector[connector.length - 1].equals("a") || connector[connector.length - 1].equals("an");
      int keep = article ? 1 : 0; // "in a mile": the article is the amount
      for (int i = 1; i < tokens.size(); i++) {
        if (matches(tokens, i, connector) && i + connector.length - keep < tokens.size()) {
          String source = String.join(" ", tokens.subList(i + connector.length - keep, tokens.size()));
          String target = String.join(" ", tokens.subList(0, i));
          requireFewSplits(candidates);
          candidates.add(candidate(c, () -> Quantity.parse(source, table, probe), target, table, probe));
        }
      }
    }
    if (candidates.isEmpty()) {
      throw new ToolException(ErrorCode.SYNTAX_ERROR, "expected 'how many UNIT in QUANTITY', as in"
          + " 'how many feet in a mile' or 'how many ml in 3 cups'");
    }
    return choose(candidates);
  }

  // ---- choosing a split ---------------------------------------------------------------------------

  private static void requireFewSplits(List<Candidate> candidates) throws ToolException {
    if (candidates.size() >= MAX_SPLITS) {
      throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "the text can be split into a quantity and a unit in more"
          + " than " + MAX_SPLITS + " places; give value, from and to as separate arguments");
    }
  }

  private record Candidate(int group, Call call, int score, ToolException error) {}

  @FunctionalInterface
  private interface QuantityReader {
    Quantity read() throws ToolException;
  }

  private static Candidate candidate(int group, QuantityReader source, String target, UnitTable table, Probe probe) {
    try {
      Quantity q = source.read();
      List<String> to = targetParts(target, table);
      ToolException e = probe.check(q, to);
      return new Candidate(group, new Call(q, to), score(e), e);
    } catch (ToolException e) {
      return new Candidate(group, null, 0, e);
    }
  }

  /** How well a split reads: it converts (2), its words read but it does not convert as is (1), or not (0). */
  private static int score(ToolException e) {
    if (e == null) {
      return 2;
    }
    ErrorCode code = e.error().code();
    return code == ErrorCode.AMBIGUOUS_UNIT || code == ErrorCode.DIMENSION_MISMATCH || code == ErrorCode.DOMAIN_ERROR
        ? 1 : 0;
  }

  private static Call choose(List<Candidate> candidates) throws ToolException {
    int best = candidates.stream().mapToInt(Candidate::score).max().orElse(0);
    if (best == 0) {
      throw firstError(candidates);
    }
    int group = candidates.stream().filter(c -> c.score == best).mapToInt(Candidate::group).min().orElseThrow();
    List<Call> winners = new ArrayList<>();
    for (Candidate c : candidates) {
      if (c.score == best && c.group == group && !winners.contains(c.call)) {
        winners.add(c.call);
      }
    }
    if (winners.size() > 1) {
      Call a = winners.get(0);
      Call b = winners.get(1);
      throw new ToolException(new ToolError(ErrorCode.SYNTAX_ERROR, "the text reads as '" + describe(a) + "' and as '"
          + describe(b) + "'; give value, from and to as separate arguments", List.of()));
    }
    return winners.get(0);
  }

  /** The error of the most telling unreadable split: an unknown or ambiguous unit before a syntax error. */
  private static ToolException firstError(List<Candidate> candidates) {
    for (Candidate c : candidates) {
      if (c.error != null && c.error.error().code() != ErrorCode.SYNTAX_ERROR) {
        return c.error;
      }
    }
    for (Candidate c : candidates) {
      if (c.error != null) {
        return c.error;
      }
    }
    return new ToolException(ErrorCode.SYNTAX_ERROR, "the text does not read as 'QUANTITY to UNIT'");
  }

  private static String describe(Call c) {
    return clip(c.quantity().canonical()) + " to " + clip(String.join("+", c.to()));
  }

  // ---- targets ------------------------------------------------------------------------------------

  /**
   * The parts of a target, cleaned: {@code ft+in}, {@code feet and inches}, {@code lb, oz} and
   * {@code h & min} give two or more; a plain unit gives one.
   */
  static List<String> targetParts(String target, UnitTable table) throws ToolException {
    String t = UnitText.prepare(target);
    List<String> parts = new ArrayList<>();
    StringBuilder current = new StringBuilder();
    boolean joined = t.indexOf('+') >= 0 || t.indexOf('&') >= 0 || t.indexOf(',') >= 0;
    for (String token : (joined ? t.replace("+", " + ").replace("&", " & ").replace(",", " , ") : t).split(" ")) {
      if (token.isEmpty()) {
        continue;
      }
      if (token.equals("+") || token.equals("&") || token.equals(",") || token.equalsIgnoreCase("and")) {
        parts.add(current.toString());
        current.setLength(0);
      } else {
        if (current.length() > 0) {
          current.append(' ');
        }
        current.append(token);
      }
    }
    parts.add(current.toString());
    List<String> out = new ArrayList<>();
    for (String p : parts) {
      String u = UnitText.cleanUnit(p, table);
      if (u.isEmpty()) {
        throw new ToolException(ErrorCode.SYNTAX_ERROR, "the target '" + clip(target) + "' has an empty part;"
            + " write it as 'cm' or, in parts, 'ft+in'");
      }
      out.add(u);
    }
    if (out.size() > Resolver.MAX_PARTS) {
      throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "a target may have at most " + Resolver.MAX_PARTS + " parts");
    }
    return out;
  }

  // ---- scanning -----------------------------------------------------------------------------------

  private static String stripEnd(String s) {
    int end = s.length();
    while (end > 0 && "?!.;: ".indexOf(s.charAt(end - 1)) >= 0) {
      end--;
    }
    String t = s.substring(0, end);
    for (String polite : new String[] {" please", ", please", " pls"}) {
      if (t.length() > polite.length() && t.regionMatches(true, t.length() - polite.length(), polite, 0, polite.length())) {
        return stripEnd(t.substring(0, t.length() - polite.length()));
      }
    }
    return t;
  }

  /** {@code 10kg->lb}: arrows and equals signs as separate words. */
  private static String spaceArrows(String s) {
    if (s.indexOf('-') < 0 && s.indexOf('→') < 0 && s.indexOf('⟶') < 0 && s.indexOf('=') < 0) {
      return s;
    }
    return s.replace("->", " -> ").replace("→", " -> ").replace("⟶", " -> ").replace("=", " = ").replace("= ?", "= ?")
        .replace("  ", " ").strip();
  }

  private static List<String> tokens(String s) {
    List<String> out = new ArrayList<>();
    for (String t : s.split(" ")) {
      if (!t.isEmpty()) {
        out.add(t);
      }
    }
    return out;
  }

  private static boolean matches(List<String> tokens, int i, String[] words) {
    if (i + words.length > tokens.size()) {
      return false;
    }
    for (int k = 0; k < words.length; k++) {
      if (!tokens.get(i + k).equalsIgnoreCase(words[k])) {
        return false;
      }
    }
    return true;
  }

  private static String clip(String s) {
    return ResultText.clean(s, 40);
  }
}
