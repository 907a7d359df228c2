package reckoner.search;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Set;
import org.junit.jupiter.api.Test;

/** The passage rule and the answer's window. */
final class PassagesTest {
  @Test
  void of_shortText_isOnePassageWithTheTitleInFront() {
    assertEquals(List.of("Tides: Spring tides rise 5.1 m. Neaps rise less."),
        Passages.of("Tides", "Spring tides   rise 5.1 m.\n\nNeaps rise less."));
  }

  @Test
  void of_sentencesArePackedWhileTheyFit() {
    String s = "A".repeat(150) + ".";        // 151 characters
    List<String> passages = Passages.of("T", s + " " + s + " " + s);
    // two sentences and a space are 303 characters (fit in 320); a third would not
    assertEquals(List.of("T: " + s + " " + s, "T: " + s), passages);
  }

  @Test
  void of_overlongSentence_isSplitAtItsLastSpaceWithinTheLimit() {
    String words = "tide ".repeat(100).strip(); // 499 characters, one sentence
    List<String> passages = Passages.of("T", words);
    assertEquals(2, passages.size());
    assertEquals("T: " + "tide ".repeat(64).strip(), passages.get(0)); // 319 characters: the last space within 320
    assertTrue(passages.stream().allMatch(p -> p.codePointCount(0, p.length()) <= Passages.MAX_LENGTH + 3));
  }

  @Test
  void snippet_shortPassage_isWhole_andAngleBracketsAreShownAsGuillemets() {
    assertEquals("T: a ‹b› c", Snippet.of("T: a <b> c", Set.of("b"), Language.NONE.analyzer()));
  }

  @Test
  void snippet_longPassage_isCutAtSpacesAroundTheQueryWords() {
    String passage = "T: " + "alpha ".repeat(40) + "harbour bridge " + "omega ".repeat(40).strip();
    String snippet = Snippet.of(passage, Set.of("harbour", "bridge"), Language.NONE.analyzer());
    assertTrue(snippet.startsWith("…alpha ") && snippet.endsWith(" omega…"), snippet);
    assertTrue(snippet.contains("harbour bridge"), snippet);
    assertTrue(snippet.codePointCount(0, snippet.length()) <= Snippet.MAX_LENGTH, snippet);
    int middle = snippet.indexOf("harbour bridge") + "harbour bridge".length() / 2;
    assertTrue(Math.abs(middle - snippet.length() / 2) <= 6, "centred: " + snippet);
  }

  @Test
  void snippet_wordsAtTheEnd_keepTheEndWithoutEllipsis() {
    String passage = "T: " + "alpha ".repeat(60) + "harbour";
    String snippet = Snippet.of(passage, Set.of("harbour"), Language.NONE.analyzer());
    assertTrue(snippet.startsWith("…") && snippet.endsWith("alpha harbour"), snippet);
  }
}
