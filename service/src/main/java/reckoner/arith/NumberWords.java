package reckoner.arith;

import java.util.Map;

/** The number words arith@2 reads: cardinals, scales, fraction words and ordinals. Constants. */
final class NumberWords {
  private NumberWords() {}

  static final Map<String, Integer> SMALL_NUMBERS = Map.ofEntries(
      Map.entry("zero", 0), Map.entry("one", 1), Map.entry("two", 2), Map.entry("three", 3), Map.entry("four", 4),
      Map.entry("five", 5), Map.entry("six", 6), Map.entry("seven", 7), Map.entry("eight", 8), Map.entry("nine", 9),
      Map.entry("ten", 10), Map.entry("eleven", 11), Map.entry("twelve", 12), Map.entry("thirteen", 13),
      Map.entry("fourteen", 14), Map.entry("fifteen", 15), Map.entry("sixteen", 16), Map.entry("seventeen", 17),
      Map.entry("eighteen", 18), Map.entry("nineteen", 19), Map.entry("twenty", 20), Map.entry("thirty", 30),
      Map.entry("forty", 40), Map.entry("fifty", 50), Map.entry("sixty", 60), Map.entry("seventy", 70),
      Map.entry("eighty", 80), Map.entry("ninety", 90));

  static final Map<String, Integer> SCALES = Map.of("thousand", 3, "million", 6, "billion", 9, "trillion", 12);

  /** Fraction words after a count: "two thirds", "a quarter". */
  static final Map<String, Integer> FRACTION_WORDS = Map.ofEntries(
      Map.entry("half", 2), Map.entry("halves", 2), Map.entry("third", 3), Map.entry("thirds", 3),
      Map.entry("quarter", 4), Map.entry("quarters", 4), Map.entry("fourth", 4), Map.entry("fourths", 4),
      Map.entry("fifth", 5), Map.entry("fifths", 5), Map.entry("sixth", 6), Map.entry("sixths", 6),
      Map.entry("seventh", 7), Map.entry("sevenths", 7), Map.entry("eighth", 8), Map.entry("eighths", 8),
      Map.entry("ninth", 9), Map.entry("ninths", 9), Map.entry("tenth", 10), Map.entry("tenths", 10),
      Map.entry("hundredth", 100), Map.entry("hundredths", 100), Map.entry("thousandth", 1000), Map.entry("thousandths", 1000));

  /** Ordinal words before "root": "fourth root of 16". */
  static final Map<String, Integer> ORDINAL_WORDS = Map.of(
      "second", 2, "third", 3, "fourth", 4, "fifth", 5, "sixth", 6, "seventh", 7, "eighth", 8, "ninth", 9, "tenth", 10);

  static Integer smallNumber(String w) {
    Integer v = SMALL_NUMBERS.get(w);
    if (v != null) {
      return v;
    }
    int hyphen = w.indexOf('-');
    if (hyphen > 0) {
      Integer tens = SMALL_NUMBERS.get(w.substring(0, hyphen));
      Integer units = SMALL_NUMBERS.get(w.substring(hyphen + 1));
      if (tens != null && units != null) {
        return tens + units;
      }
    }
    return null;
  }
}
