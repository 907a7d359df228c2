package reckoner.facts;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import static org.quicktheories.QuickTheory.qt;
import static org.quicktheories.generators.SourceDSL.strings;

import org.quicktheories.core.Gen;
import org.junit.jupiter.api.Test;

/**
 * Key matching checked against the published Unicode data. Sources, named at each check:
 * NormalizationTest-16.0.0.txt (Unicode Character Database, the conformance data of UAX #15;
 * columns source; NFC; NFD; NFKC; NFKD), CaseFolding.txt (status C and F lines are the full case
 * folding), and UAX #15 itself. Where a value comes from memory rather than a file read while
 * writing this test, the comment says "from memory".
 */
final class KeyNormalizerTest {
  private static String cps(int... codePoints) {
    return new String(codePoints, 0, codePoints.length);
  }

  /* ---------------- canonical equivalence: composed and decomposed forms ---------------- */

  @Test
  void normalize_composedAndDecomposedRingA_match() {
    // NormalizationTest-16.0.0.txt Part 1: "00C5;00C5;0041 030A;00C5;0041 030A;"
    // CaseFolding.txt: "00C5; C; 00E5; # LATIN CAPITAL LETTER A WITH RING ABOVE"
    assertEquals(cps(0xE5), KeyNormalizer.normalize(cps(0x00C5)));
    assertEquals(cps(0xE5), KeyNormalizer.normalize(cps(0x0041, 0x030A)));
  }

  @Test
  void normalize_angstromSign_isRingA() {
    // CaseFolding.txt: "212B; C; 00E5; # ANGSTROM SIGN"; its NFC is U+00C5 (UAX #15 singleton example, from memory)
    assertEquals(cps(0xE5), KeyNormalizer.normalize(cps(0x212B)));
  }

  @Test
  void normalize_marksInAnyOrder_giveOneForm() {
    // NormalizationTest-16.0.0.txt Part 0:
    //   "1E0A 0323;1E0C 0307;0044 0323 0307;1E0C 0307;0044 0323 0307;"
    //   "0044 0307 0323;1E0C 0307;0044 0323 0307;1E0C 0307;0044 0323 0307;"
    // NFKC is 1E0C 0307; case folded (CaseFolding.txt "1E0C; C; 1E0D") it is 1E0D 0307.
    String expected = cps(0x1E0D, 0x0307);
    assertEquals(expected, KeyNormalizer.normalize(cps(0x1E0A, 0x0323)));
    assertEquals(expected, KeyNormalizer.normalize(cps(0x0044, 0x0307, 0x0323)));
    assertEquals(expected, KeyNormalizer.normalize(cps(0x0044, 0x0323, 0x0307)));
  }

  @Test
  void normalize_longSWithDots_uax15Example() {
    // UAX #15's worked example "ẛ̣" U+1E9B U+0323: NFKC is U+1E69 (from memory).
    // CaseFolding.txt: "1E9B; C; 1E61; # LATIN SMALL LETTER LONG S WITH DOT ABOVE" and "1E68; C; 1E69".
    assertEquals(cps(0x1E69), KeyNormalizer.normalize(cps(0x1E9B, 0x0323)));
  }

  @Test
  void normalize_hangulJamo_composeToSyllables() {
    // NormalizationTest-16.0.0.txt Part 0: "1100 AC00 11A8;1100 AC01;1100 1100 1161 11A8;1100 AC01;..."
    assertEquals(cps(0x1100, 0xAC01), KeyNormalizer.normalize(cps(0x1100, 0xAC00, 0x11A8)));
  }

  /* ---------------- compatibility forms ---------------- */

  @Test
  void normalize_fiLigature_isPlainFi() {
    // NormalizationTest-16.0.0.txt Part 1: "FB01;FB01;FB01;0066 0069;0066 0069;"
    // CaseFolding.txt: "FB01; F; 0066 0069; # LATIN SMALL LIGATURE FI"
    assertEquals("fish", KeyNormalizer.normalize("\uFB01sh"));
  }

  @Test
  void normalize_ffiLigature_isPlainFfi() {
    // CaseFolding.txt: "FB03; F; 0066 0066 0069; # LATIN SMALL LIGATURE FFI"
    assertEquals("office", KeyNormalizer.normalize("o\uFB03ce"));
  }

  @Test
  void normalize_fullWidthLetters_arePlainLetters() {
    // CaseFolding.txt: "FF21; C; FF41; # FULLWIDTH LATIN CAPITAL LETTER A"; the NFKC of U+FF21 is U+0041
    // (NormalizationTest Part 1 "FF21;FF21;FF21;0041;0041;", from memory).
    assertEquals("capital", KeyNormalizer.normalize("\uFF23\uFF21\uFF30\uFF29\uFF34\uFF21\uFF2C"));
  }

  @Test
  void normalize_ijLigature_isIj() {
    // NormalizationTest-16.0.0.txt Part 1: "0132;0132;0132;0049 004A;0049 004A;"
    assertEquals("ijssel", KeyNormalizer.normalize("\u0132ssel"));
  }

  @Test
  void normalize_superscriptTwo_isDigitTwo() {
    // NormalizationTest-16.0.0.txt Part 1: "00B2;00B2;00B2;0032;0032;"
    assertEquals("km2", KeyNormalizer.normalize("km\u00B2"));
  }

  @Test
  void normalize_apostropheN_isModifierApostropheAndN() {
    // NormalizationTest-16.0.0.txt Part 1: "0149;0149;0149;02BC 006E;02BC 006E;"
    // CaseFolding.txt: "0149; F; 02BC 006E; # LATIN SMALL LETTER N PRECEDED BY APOSTROPHE"
    assertEquals(cps(0x02BC, 0x6E), KeyNormalizer.normalize(cps(0x0149)));
  }

  @Test
  void normalize_kelvinAndMicroSigns_foldToLetters() {
    // CaseFolding.txt: "212A; C; 006B; # KELVIN SIGN" and "00B5; C; 03BC; # MICRO SIGN"
    assertEquals("k", KeyNormalizer.normalize("\u212A"));
    assertEquals(cps(0x03BC), KeyNormalizer.normalize("\u00B5"));
  }

  /* ---------------- full case folding ---------------- */

  @Test
  void normalize_sharpS_foldsToSs() {
    // CaseFolding.txt: "00DF; F; 0073 0073; # LATIN SMALL LETTER SHARP S" (full folding, status F)
    assertEquals("strasse", KeyNormalizer.normalize("Straße"));
    assertEquals(KeyNormalizer.normalize("STRASSE"), KeyNormalizer.normalize("Straße"));
  }

  @Test
  void normalize_capitalSharpS_foldsToSs() {
    // CaseFolding.txt: "1E9E; F; 0073 0073; # LATIN CAPITAL LETTER SHARP S" (from memory; added in Unicode 5.1)
    assertEquals("strasse", KeyNormalizer.normalize("STRA\u1E9EE"));
  }

  @Test
  void normalize_finalSigma_foldsToSigma() {
    // CaseFolding.txt: "03C2; C; 03C3; # GREEK SMALL LETTER FINAL SIGMA" and "03A3; C; 03C3; # GREEK CAPITAL LETTER SIGMA"
    String expected = cps(0x03BF, 0x03B4, 0x03BF, 0x03C3); // οδοσ
    assertEquals(expected, KeyNormalizer.normalize(cps(0x039F, 0x0394, 0x039F, 0x03A3))); // ΟΔΟΣ
    assertEquals(expected, KeyNormalizer.normalize(cps(0x03BF, 0x03B4, 0x03BF, 0x03C2))); // οδος
    assertEquals(expected, KeyNormalizer.normalize(cps(0x03BF, 0x03B4, 0x03BF, 0x03C3))); // οδοσ
  }

  @Test
  void normalize_capitalIWithDot_foldsToIAndCombiningDot() {
    // CaseFolding.txt: "0130; F; 0069 0307; # LATIN CAPITAL LETTER I WITH DOT ABOVE" (the T line is not used)
    assertEquals(cps(0x69, 0x0307, 0x6C), KeyNormalizer.normalize(cps(0x0130, 0x4C)));
  }

  @Test
  void normalize_greekIotaWithDialytikaAndTonos_foldsToThreeCodePoints() {
    // CaseFolding.txt: "0390; F; 03B9 0308 0301; # GREEK SMALL LETTER IOTA WITH DIALYTIKA AND TONOS";
    // NFKC then recomposes 03B9 0308 0301 to U+0390 (canonical composition; from memory).
    assertEquals(KeyNormalizer.normalize(cps(0x03B9, 0x0308, 0x0301)), KeyNormalizer.normalize(cps(0x0390)));
  }

  /* ---------------- white space and invisible characters ---------------- */

  @Test
  void normalize_runsOfWhiteSpace_collapseToOneSpace() {
    assertEquals("harbour master", KeyNormalizer.normalize("  Harbour \t\n  MASTER  "));
  }

  @Test
  void normalize_noBreakAndIdeographicSpace_areSpaces() {
    // NormalizationTest-16.0.0.txt Part 1: "00A0;00A0;00A0;0020;0020;"; U+3000 has NFKC U+0020 (from memory)
    assertEquals("harbour master", KeyNormalizer.normalize("harbour\u00A0master"));
    assertEquals("harbour master", KeyNormalizer.normalize("harbour\u3000\u3000master"));
  }

  @Test
  void normalize_zeroWidthCharacters_areRemoved() {
    // NFKC_Casefold removes Default_Ignorable_Code_Point characters such as U+200B and U+00AD (UAX #44 /
    // DerivedNormalizationProps.txt, from memory).
    assertEquals("capital", KeyNormalizer.normalize("cap\u200Bi\u00ADtal"));
  }

  @Test
  void normalize_onlyWhiteSpace_isEmpty() {
    assertEquals("", KeyNormalizer.normalize(" \t\u3000 "));
  }

  /* ---------------- accent folding ---------------- */

  @Test
  void foldAccents_acuteAndGrave_areDropped() {
    assertEquals("fete des marees", KeyNormalizer.normalizeFoldingAccents("Fête des Marées"));
    assertEquals("creme", KeyNormalizer.normalizeFoldingAccents("Cre\u0300me")); // decomposed input too
  }

  @Test
  void foldAccents_greekTonos_isDropped() {
    assertEquals(cps(0x03BF, 0x03C1, 0x03BC, 0x03BF, 0x03C3),
        KeyNormalizer.normalizeFoldingAccents(cps(0x038C, 0x03A1, 0x039C, 0x039F, 0x03A3))); // ΌΡΜΟΣ
  }

  @Test
  void foldAccents_lettersWithoutDecomposition_stay() {
    // U+00F8 ø, U+0142 ł and U+0111 đ have no canonical decomposition in UnicodeData.txt (from memory).
    assertEquals("fj\u00F8llin", KeyNormalizer.normalizeFoldingAccents("FJ\u00D8LLIN"));
    assertEquals("\u0142\u0111", KeyNormalizer.normalizeFoldingAccents("\u0141\u0110"));
  }

  @Test
  void normalize_withoutAccentFolding_keepsAccents() {
    assertNotEquals(KeyNormalizer.normalize("Aurélie"), KeyNormalizer.normalize("Aurelie"));
  }

  /* ---------------- properties ---------------- */

  /** Any code points, up to 40 of them (QuickTheories, fixed seeds). */
  private static final Gen<String> ANY = strings().allPossible().ofLengthBetween(0, 40);

  @Test
  void normalize_isIdempotent() {
    qt().withExamples(400).withFixedSeed(21L).forAll(ANY).checkAssert(s -> {
      String once = KeyNormalizer.normalize(s);
      assertEquals(once, KeyNormalizer.normalize(once));
    });
  }

  @Test
  void foldAccents_isIdempotentAndStableUnderNormalize() {
    qt().withExamples(400).withFixedSeed(22L).forAll(ANY).checkAssert(s -> {
      String folded = KeyNormalizer.normalizeFoldingAccents(s);
      assertEquals(folded, KeyNormalizer.normalizeFoldingAccents(folded));
      assertEquals(folded, KeyNormalizer.normalize(folded));
    });
  }

  @Test
  void normalize_neverLeavesEdgeOrDoubleSpaces() {
    qt().withExamples(400).withFixedSeed(23L).forAll(ANY).checkAssert(s -> {
      String n = KeyNormalizer.normalize(s);
      assertFalse(n.startsWith(" ") || n.endsWith(" ") || n.contains("  "), n);
      assertTrue(n.codePoints().noneMatch(cp -> cp != ' ' && com.ibm.icu.lang.UCharacter.isUWhiteSpace(cp)), n);
    });
  }
}
