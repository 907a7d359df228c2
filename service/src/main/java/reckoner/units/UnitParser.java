package reckoner.units;

import java.math.BigDecimal;
import java.util.Optional;
import reckoner.tool.ErrorCode;
import reckoner.tool.ResultText;
import reckoner.tool.ToolError;
import reckoner.tool.ToolException;

/**
 * Parses a unit expression into a {@link Unit}. The grammar, after Unicode NFKC normalisation:
 *
 * <pre>
 * expression := product (('*' | '·' | '×' | '/' | 'per') product)*      left to right
 * product    := power ((' ' | '-') power)*                              a space binds tighter
 * power      := ('square' | 'sq' | 'cubic' | 'cu') power
 *             | atom (('^' | '**') integer | digits | '-' digits)? ('squared' | 'cubed')?
 * atom       := number | unit word | phrase | '(' expression ')'
 * </pre>
 *
 * So {@code kg·m/s^2}, {@code km/h}, {@code J/(kg·K)}, {@code L/100 km}, {@code m²} (NFKC: m2),
 * {@code W m-2}, {@code miles per hour}, {@code square feet}. A space is a product that binds
 * tighter than {@code /}, as people write {@code J/kg K}; after {@code /}, a {@code *} or
 * {@code ·} without parentheses is refused as ambiguous (SI Brochure, 9th edition, 5.4.6).
 * Limits: 200 characters, 10 nested parentheses, exponents within ±12, every dimension
 * exponent within ±24 and every factor within 1e±600 ({@code limit_exceeded}). Not thread-safe;
 * one instance parses one expression.
 *
 * <p>How a word is read beyond the table's exact spellings is up to a {@link Readings}:
 * {@code units@1} uses {@link Readings#STRICT} (an unknown word, an ambiguous name and an offset
 * scale in a compound are refused); {@code units@2} reads case variants, default readings by
 * system and offset scales in compounds as differences.
 */
final class UnitParser {
  /**
   * How words are read where the table alone does not decide. Each method is asked only where
   * {@link #STRICT} would refuse or keep the exact reading, so a strict parse is the parse of units@1.
   */
  interface Readings {
    /** units@1: exact spellings only, every ambiguous name refused. */
    Readings STRICT = new Readings() {};

    /**
     * Another reading of a word the table reads exactly ({@code F} as °F next to a temperature);
     * {@code whole} says whether the word is the whole expression.
     */
    default UnitTable.Resolved exact(UnitTable.Resolved r, String written, boolean whole) throws ToolException {
      return r;
    }

    /** A reading of a word the table does not know ({@code KM}); empty to refuse it as unknown. */
    default Optional<UnitTable.Resolved> unknown(String written, boolean whole) throws ToolException {
      return Optional.empty();
    }

    /** The reading an ambiguous name takes; empty to refuse it, listing its readings. */
    default Optional<UnitTable.Resolved> ambiguous(UnitTable.Resolved r, String written, boolean whole)
        throws ToolException {
      return Optional.empty();
    }

    /** Whether an offset scale (°C, °F) inside a compound is read as a difference (1 °C = 1 K). */
    default boolean offsetInCompound(UnitDef scale) {
      return false;
    }
  }

  static final int MAX_LENGTH = 200;
  static final int MAX_DEPTH = 10;
  static final int MAX_EXPONENT = 12;
  static final int MAX_DIMENSION_EXPONENT = 24;
  static final int MAX_FACTOR_LOG10 = 600;
  private static final int MAX_NUMBER_LENGTH = 30;

  private final String text;
  private final String original;
  private final UnitTable table;
  private final Readings readings;
  private int pos;
  private int depth;
  private boolean inParenthesizedExponent;

  /** A partial result: the unit so far and the row it is, while it is one bare word. */
  private record Term(Unit unit, UnitDef bare) {
    Term combined(Unit u) {
      return new Term(u, null);
    }
  }

  private UnitParser(String original, UnitTable table, Readings readings) {
    this.original = original;
    this.text = Words.normalize(original);
    this.table = table;
    this.readings = readings;
  }

  /** Parses {@code expression} against {@code table}; bad input is a ToolException with its code. */
  static Unit parse(String expression, UnitTable table) throws ToolException {
    return parse(expression, table, Readings.STRICT);
  }

  /** Parses {@code expression} against {@code table}, reading words as {@code readings} says. */
  static Unit parse(String expression, UnitTable table, Readings readings) throws ToolException {
    if (expression.length() > MAX_LENGTH) {
      throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "a unit expression may have at most " + MAX_LENGTH
          + " characters but this one has " + expression.length());
    }
    UnitParser p = new UnitParser(expression, table, readings);
    if (p.text.isEmpty()) {
      throw new ToolException(ErrorCode.INVALID_ARGUMENT, "the unit is empty");
    }
    Term t = p.expression();
    p.skipSpaces();
    if (p.pos < p.text.length()) {
      throw p.syntax("unexpected '" + p.text.charAt(p.pos) + "'");
    }
    Unit u = t.unit;
    if (t.bare != null) {
      return new Unit(u.factor(), u.dimension(), t.bare.offset(), t.bare.interval(), true);
    }
    return u;
  }

  // ---- grammar --------------------------------------------------------------------------------

  private Term expression() throws ToolException {
    Term left = product();
    boolean divided = false;
    while (true) {
      skipSpaces();
      if (atEnd()) {
        return left;
      }
      char c = text.charAt(pos);
      if (c == '*' || c == '·' || c == '×' || c == '⋅' || c == '∙') {
        if (divided) {
          throw syntax("a product after '/' is ambiguous; write the denominator in parentheses, as in J/(kg·K)");
        }
        if (c == '*' && pos + 1 < text.length() && text.charAt(pos + 1) == '*') {
          throw syntax("'**' must follow a unit directly, as a power");
        }
        pos++;
        left = combine(left, product(), false);
      } else if (c == '/' || c == '÷' || atKeyword("per")) {
        pos += c == '/' || c == '÷' ? 1 : 3;
        left = combine(left, product(), true);
        divided = true;
      } else {
        return left;
      }
    }
  }

  private Term product() throws ToolException {
    Term left = power();
    while (true) {
      int save = pos;
      skipSpaces();
      if (!atEnd() && text.charAt(pos) == '-' && pos + 1 < text.length() && Words.isWordStart(text.charAt(pos + 1))) {
        pos++; // N-m, kW-h: a hyphen between words is a product
      }
      if (atEnd() || !startsAtom() || atKeyword("per")) {
        pos = save;
        return left;
      }
      left = combine(left, power(), false);
    }
  }

  private Term power() throws ToolException {
    skipSpaces();
    {
      for (String[] modifier : new String[][] {{"square", "2"}, {"sq", "2"}, {"cubic", "3"}, {"cu", "3"}}) {
        if (atKeyword(modifier[0])) {
          pos += modifier[0].length();
          skipSpaces();
          if (atEnd() || !startsAtom()) {
            throw syntax("'" + modifier[0] + "' must be followed by a unit");
          }
          return raise(power(), Integer.parseInt(modifier[1]));
        }
      }
    }
    Term base = atom();
    Optional<Integer> exponent = exponent();
    Term result = exponent.isPresent() ? raise(base, exponent.get()) : base;
    int save = pos;
    skipSpaces();
    if (atKeyword("squared")) {
      pos += "squared".length();
      return raise(result, 2);
    }
    if (atKeyword("cubed")) {
      pos += "cubed".length();
      return raise(result, 3);
    }
    pos = save;
    return result;
  }

  private Optional<Integer> exponent() throws ToolException {
    if (atEnd()) {
      return Optional.empty();
    }
    char c = text.charAt(pos);
    if (c == '^' || (c == '*' && pos + 1 < text.length() && text.charAt(pos + 1) == '*')) {
      pos += c == '^' ? 1 : 2;
      skipSpaces();
      boolean paren = !atEnd() && text.charAt(pos) == '(';
      if (paren) {
        pos++;
      }
      inParenthesizedExponent = paren;
      int value = signedInteger();
      inParenthesizedExponent = false;
      if (paren) {
        if (atEnd() || text.charAt(pos) != ')') {
          throw syntax("expected ')' after the exponent");
        }
        pos++;
      }
      return Optional.of(value);
    }
    if ((c == '-' || c == '−') && pos + 1 < text.length() && isDigit(text.charAt(pos + 1))) {
      return Optional.of(signedInteger()); // W m-2
    }
    if (isDigit(c)) {
      return Optional.of(signedInteger()); // (m/s)2
    }
    return Optional.empty();
  }

  private int signedInteger() throws ToolException {
    int start = pos;
    boolean negative = false;
    if (!atEnd() && (text.charAt(pos) == '-' || text.charAt(pos) == '−' || text.charAt(pos) == '+')) {
      negative = text.charAt(pos) != '+';
      pos++;
    }
    int digitsStart = pos;
    while (!atEnd() && isDigit(text.charAt(pos))) {
      pos++;
    }
    if (pos == digitsStart) {
      throw syntax("expected a whole-number exponent");
    }
    boolean fraction = !atEnd() && text.charAt(pos) == '.' && pos + 1 < text.length() && isDigit(text.charAt(pos + 1));
    if (fraction || (inParenthesizedExponent && !atEnd() && text.charAt(pos) == '/')) {
      throw syntax("exponents must be whole numbers from -" + MAX_EXPONENT + " to " + MAX_EXPONENT);
    }
    String digits = text.substring(digitsStart, pos);
    if (digits.length() > 3 || Integer.parseInt(digits) > MAX_EXPONENT) {
      throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "exponent " + clip(text.substring(start, pos))
          + " is out of range; exponents must be within ±" + MAX_EXPONENT);
    }
    int value = Integer.parseInt(digits);
    return negative ? -value : value;
  }

  private Term atom() throws ToolException {
    skipSpaces();
    if (atEnd()) {
      throw syntax("expected a unit at the end");
    }
    Optional<UnitTable.PhraseMatch> phrase = table.phrase(text, pos);
    if (phrase.isPresent()) {
      String word = text.substring(pos, phrase.get().end());
      boolean whole = pos == 0 && phrase.get().end() == text.length();
      pos = phrase.get().end();
      return term(readings.exact(phrase.get().resolved(), word, whole), word, whole);
    }
    char c = text.charAt(pos);
    if (c == '(') {
      if (++depth > MAX_DEPTH) {
        throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "parentheses may nest at most " + MAX_DEPTH + " deep");
      }
      pos++;
      Term inner = expression();
      skipSpaces();
      if (atEnd() || text.charAt(pos) != ')') {
        throw syntax("expected ')'");
      }
      pos++;
      depth--;
      return inner.combined(checkAffine(inner, false).unit);
    }
    if (isDigit(c) || (c == '.' && pos + 1 < text.length() && isDigit(text.charAt(pos + 1)))) {
      return number();
    }
    if (Words.isSignWord(c)) {
      pos++;
      return word(String.valueOf(c));
    }
    if (!Words.isWordStart(c)) {
      throw syntax("expected a unit but found '" + c + "'");
    }
    int start = pos;
    while (!atEnd() && Words.isWordPart(text.charAt(pos))) {
      pos++;
    }
    String w = text.substring(start, pos);
    boolean whole = start == 0 && pos == text.length();
    Optional<UnitTable.Resolved> exact = table.resolve(w);
    if (exact.isPresent()) {
      return term(readings.exact(exact.get(), w, whole), w, whole);
    }
    int stem = w.length();
    while (stem > 0 && isDigit(w.charAt(stem - 1))) {
      stem--;
    }
    if (stem < w.length()) {
      pos = start + stem; // m2, cm3: the digits are the exponent
      String base = w.substring(0, stem);
      Optional<UnitTable.Resolved> r = table.resolve(base);
      if (r.isPresent()) {
        return term(readings.exact(r.get(), base, false), base, false);
      }
      Optional<UnitTable.Resolved> other = stem == 0 ? Optional.empty() : readings.unknown(base, false);
      if (other.isPresent()) {
        return term(other.get(), base, false);
      }
      throw unknown(base);
    }
    Optional<UnitTable.Resolved> other = readings.unknown(w, whole);
    if (other.isPresent()) {
      return term(other.get(), w, whole);
    }
    throw unknown(w);
  }

  private Term word(String w) throws ToolException {
    Optional<UnitTable.Resolved> r = table.resolve(w);
    if (r.isEmpty()) {
      throw unknown(w);
    }
    boolean whole = text.length() == w.length();
    return term(readings.exact(r.get(), w, whole), w, whole);
  }

  private Term term(UnitTable.Resolved r, String written, boolean whole) throws ToolException {
    UnitDef def = r.def();
    if (def.isAmbiguous()) {
      Optional<UnitTable.Resolved> chosen = readings.ambiguous(r, written, whole);
      if (chosen.isEmpty()) {
        throw new ToolException(new ToolError(ErrorCode.AMBIGUOUS_UNIT,
            "'" + clip(written) + "' is ambiguous: " + table.describeReadings(def, r.prefix()),
            table.readingSymbols(def, r.prefix())));
      }
      r = chosen.get();
      def = r.def();
    }
    Factor f = def.factor();
    if (r.prefix() != null) {
      f = f.times(Factor.of(r.prefix().factor()));
    }
    return new Term(Unit.of(f, def.dimension()), r.prefix() == null ? def : null);
  }

  private Term number() throws ToolException {
    int start = pos;
    while (!atEnd() && isDigit(text.charAt(pos))) {
      pos++;
    }
    if (!atEnd() && text.charAt(pos) == '.') {
      pos++;
      while (!atEnd() && isDigit(text.charAt(pos))) {
        pos++;
      }
    }
    if (pos + 1 < text.length() && (text.charAt(pos) == 'e' || text.charAt(pos) == 'E')) {
      int save = pos;
      pos++;
      if (text.charAt(pos) == '+' || text.charAt(pos) == '-') {
        pos++;
      }
      if (atEnd() || !isDigit(text.charAt(pos))) {
        pos = save; // not an exponent: 1em is 1 and a unit
      }
      while (!atEnd() && isDigit(text.charAt(pos))) {
        pos++;
      }
    }
    String literal = text.substring(start, pos);
    if (literal.length() > MAX_NUMBER_LENGTH) {
      throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "a number in a unit may have at most "
          + MAX_NUMBER_LENGTH + " characters");
    }
    BigDecimal value;
    try {
      value = new BigDecimal(literal);
    } catch (NumberFormatException e) {
      throw syntax("malformed number '" + clip(literal) + "'");
    }
    if (Math.abs(value.precision() - value.scale() - 1) > MAX_FACTOR_LOG10) {
      throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "a number in a unit must be within 1e±" + MAX_FACTOR_LOG10);
    }
    if (value.signum() == 0) {
      throw new ToolException(ErrorCode.INVALID_ARGUMENT, "a number inside a unit must not be zero");
    }
    Rational r = Rational.of(value);
    checkMagnitude(Factor.of(r));
    return new Term(Unit.of(Factor.of(r), Dimension.NONE), null);
  }

  // ---- combining ------------------------------------------------------------------------------

  private Term combine(Term left, Term right, boolean divide) throws ToolException {
    checkAffine(left, true);
    checkAffine(right, true);
    Unit a = left.unit;
    Unit b = right.unit;
    Dimension d = divide ? a.dimension().divide(b.dimension()) : a.dimension().times(b.dimension());
    checkDimension(d);
    Factor f = divide ? a.factor().divide(b.factor()) : a.factor().times(b.factor());
    checkMagnitude(f);
    return new Term(Unit.of(f, d), null);
  }

  private Term raise(Term base, int exponent) throws ToolException {
    if (exponent == 1) {
      return base;
    }
    checkAffine(base, true);
    Unit u = base.unit;
    Dimension d = u.dimension().pow(exponent);
    checkDimension(d);
    double log = (u.factor().coefficient().log10Estimate() + u.factor().piPower() * 0.5) * exponent;
    if (Math.abs(log) > MAX_FACTOR_LOG10) {
      throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "the unit's factor would exceed 1e±" + MAX_FACTOR_LOG10);
    }
    return new Term(Unit.of(u.factor().pow(exponent), d), null);
  }

  private Term checkAffine(Term t, boolean compound) throws ToolException {
    if (t.bare != null && t.bare.hasOffset()) {
      if (compound && readings.offsetInCompound(t.bare)) {
        return t; // the factor alone is the difference: 1 °C = 1 K, 1 °F = 5/9 K
      }
      String s = t.bare.shownSymbol();
      throw new ToolException(ErrorCode.INVALID_ARGUMENT, s + " is a temperature scale with an offset and cannot be"
          + " part of a compound unit; use K, °R or a difference unit (Δ" + s + ") in '" + clip(original) + "'");
    }
    return t;
  }

  private static void checkDimension(Dimension d) throws ToolException {
    if (d.maxAbsExponent() > MAX_DIMENSION_EXPONENT) {
      throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "the unit's dimension has an exponent beyond ±"
          + MAX_DIMENSION_EXPONENT);
    }
  }

  private static void checkMagnitude(Factor f) throws ToolException {
    if (Math.abs(f.coefficient().log10Estimate()) > MAX_FACTOR_LOG10) {
      throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "the unit's factor would exceed 1e±" + MAX_FACTOR_LOG10);
    }
  }

  // ---- scanning -------------------------------------------------------------------------------

  private boolean startsAtom() {
    char c = text.charAt(pos);
    return c == '(' || isDigit(c) || Words.isWordStart(c) || Words.isSignWord(c)
        || (c == '.' && pos + 1 < text.length() && isDigit(text.charAt(pos + 1)));
  }

  /** Whether the word {@code keyword} (any case) starts here and ends at a word boundary. */
  private boolean atKeyword(String keyword) {
    int end = pos + keyword.length();
    if (end > text.length() || !text.regionMatches(true, pos, keyword, 0, keyword.length())
        || (end < text.length() && Words.isWordPart(text.charAt(end)))) {
      return false;
    }
    return table.phrase(text, pos).isEmpty(); // "per cent" is a unit, not a quotient
  }

  private int skipSpaces() {
    int start = pos;
    while (!atEnd() && text.charAt(pos) == ' ') {
      pos++;
    }
    return pos - start;
  }

  private boolean atEnd() {
    return pos >= text.length();
  }

  private static boolean isDigit(char c) {
    return c >= '0' && c <= '9';
  }

  private ToolException syntax(String what) {
    return new ToolException(ErrorCode.SYNTAX_ERROR, what + " at position " + (pos + 1) + " of unit '"
        + clip(original) + "'");
  }

  private ToolException unknown(String word) {
    String where = word.equals(text) ? "" : " in '" + clip(original) + "'";
    return new ToolException(new ToolError(ErrorCode.UNKNOWN_UNIT, "unknown unit '" + clip(word) + "'" + where,
        table.suggest(word)));
  }

  private static String clip(String s) {
    return ResultText.clean(s, 40);
  }
}
