package reckoner.ops;

import java.util.Set;
import java.util.TreeSet;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * The metric names a PromQL expression reads: what is left of it once strings, label matchers,
 * ranges, grouping clauses, functions and keywords are taken out. Enough for the expressions of
 * the alert rules and the dashboard; not a PromQL parser.
 */
final class PromQlNames {
  private static final Pattern STRING = Pattern.compile("\"(?:[^\"\\\\]|\\\\.)*\"");
  private static final Pattern MATCHERS = Pattern.compile("\\{[^}]*}");
  private static final Pattern RANGE = Pattern.compile("\\[[^]]*]");
  private static final Pattern GROUPING =
      Pattern.compile("\\b(?:by|without|on|ignoring|group_left|group_right)\\s*\\([^)]*\\)");
  private static final Pattern IDENTIFIER = Pattern.compile("(?<![\\w.$])([a-zA-Z_:][a-zA-Z0-9_:]*+)(?!\\s*\\()");
  private static final Set<String> KEYWORDS = Set.of("and", "or", "unless", "bool", "offset", "inf", "nan", "e");

  private PromQlNames() {}

  static Set<String> of(String expr) {
    String rest = STRING.matcher(expr).replaceAll("\"\"");
    rest = MATCHERS.matcher(rest).replaceAll(" ");
    rest = RANGE.matcher(rest).replaceAll(" ");
    rest = GROUPING.matcher(rest).replaceAll(" ");
    Set<String> names = new TreeSet<>();
    Matcher m = IDENTIFIER.matcher(rest);
    while (m.find()) {
      if (!KEYWORDS.contains(m.group(1))) {
        names.add(m.group(1));
      }
    }
    return names;
  }
}
