package reckoner.facts;

import com.ibm.icu.lang.UCharacter;
import com.ibm.icu.lang.UCharacterCategory;
import com.ibm.icu.text.Normalizer2;

/**
 * How fact keys are compared: Unicode NFKC_Casefold (UAX #15 compatibility normalisation with the
 * full case foldings of CaseFolding.txt, default-ignorable code points removed), then every run of
 * Unicode White_Space collapsed to one U+0020 and the ends trimmed. Sets that ask for it also fold
 * accents: the canonical decomposition's nonspacing marks (general category Mn) are dropped, so
 * {@code é} matches {@code e}; letters that Unicode does not decompose ({@code ø}, {@code ł},
 * {@code đ}) stay as they are. Pure functions; thread-safe.
 */
final class KeyNormalizer {
  private static final Normalizer2 NFKC_CF = Normalizer2.getNFKCCasefoldInstance();
  private static final Normalizer2 NFD = Normalizer2.getNFDInstance();

  private KeyNormalizer() {}

  /** The comparison form of {@code text}; idempotent. */
  static String normalize(String text) {
    return collapseWhiteSpace(NFKC_CF.normalize(text));
  }

  /** The comparison form with accents folded; idempotent, and a fixed point of {@link #normalize}. */
  static String normalizeFoldingAccents(String text) {
    return normalize(dropNonspacingMarks(NFD.normalize(normalize(text))));
  }

  static String normalize(String text, boolean foldAccents) {
    return foldAccents ? normalizeFoldingAccents(text) : normalize(text);
  }

  /** Folds the accents of an already normalised key (cheaper than starting again from raw text). */
  static String foldAccents(String normalized) {
    return normalizeFoldingAccents(normalized);
  }

  private static String dropNonspacingMarks(String decomposed) {
    StringBuilder sb = new StringBuilder(decomposed.length());
    for (int i = 0; i < decomposed.length(); ) {
      int cp = decomposed.codePointAt(i);
      i += Character.charCount(cp);
      if (UCharacter.getType(cp) != UCharacterCategory.NON_SPACING_MARK) {
        sb.appendCodePoint(cp);
      }
    }
    return sb.toString();
  }

  private static String collapseWhiteSpace(String text) {
    if (isCollapsed(text)) {
      return text; // the common case: no copy
    }
    StringBuilder sb = new StringBuilder(text.length());
    boolean pendingSpace = false;
    for (int i = 0; i < text.length(); ) {
      int cp = text.codePointAt(i);
      i += Character.charCount(cp);
      if (UCharacter.isUWhiteSpace(cp)) {
        pendingSpace = sb.length() > 0;
        continue;
      }
      if (pendingSpace) {
        sb.append(' ');
        pendingSpace = false;
      }
      sb.appendCodePoint(cp);
    }
    return sb.toString();
  }

  /** Whether white space in {@code text} is already single U+0020 between other characters. */
  private static boolean isCollapsed(String text) {
    boolean previousSpace = true; // no space at the start
    for (int i = 0; i < text.length(); ) {
      int cp = text.codePointAt(i);
      i += Character.charCount(cp);
      boolean space = UCharacter.isUWhiteSpace(cp);
      if (space && (cp != ' ' || previousSpace)) {
        return false;
      }
      previousSpace = space;
    }
    return !previousSpace || text.isEmpty();
  }
}
