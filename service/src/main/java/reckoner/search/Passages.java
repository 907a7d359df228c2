package reckoner.search;

import com.ibm.icu.text.BreakIterator;
import com.ibm.icu.util.ULocale;
import java.util.ArrayList;
import java.util.List;

/**
 * How a document becomes passages. The text's white space is collapsed (every run of white space
 * becomes one space, ends trimmed), the text is split into sentences at the sentence boundaries of
 * Unicode UAX #29 (ICU4J, root locale), a sentence longer than {@link #MAX_LENGTH} characters is
 * split at its last space within the limit (or cut at the limit if it has none), and consecutive
 * sentences are packed greedily, joined by one space, while the passage stays within {@link
 * #MAX_LENGTH} characters. Each passage is then the title, {@code ": "} and its sentences, so the
 * title's words count in every passage. Lengths count Unicode code points. Pure functions; thread-safe.
 */
final class Passages {
  /** Most characters of sentences in one passage (the title comes on top). */
  static final int MAX_LENGTH = 320;
  /** Between a passage's title and its sentences. */
  static final String TITLE_SEPARATOR = ": ";

  private Passages() {}

  /** The passages of a document, in order (position 0 first); at least one when the text has any content. */
  static List<String> of(String title, String text) {
    List<String> passages = new ArrayList<>();
    StringBuilder current = new StringBuilder();
    int currentLength = 0;
    for (String sentence : sentences(collapse(text))) {
      int length = sentence.codePointCount(0, sentence.length());
      if (currentLength > 0 && currentLength + 1 + length > MAX_LENGTH) {
        passages.add(title + TITLE_SEPARATOR + current);
        current.setLength(0);
        currentLength = 0;
      }
      if (currentLength > 0) {
        current.append(' ');
        currentLength++;
      }
      current.append(sentence);
      currentLength += length;
    }
    if (currentLength > 0) {
      passages.add(title + TITLE_SEPARATOR + current);
    }
    return passages;
  }

  /** The sentences of already collapsed text, each at most {@link #MAX_LENGTH} characters. */
  static List<String> sentences(String text) {
    List<String> sentences = new ArrayList<>();
    BreakIterator it = BreakIterator.getSentenceInstance(ULocale.ROOT);
    it.setText(text);
    int start = it.first();
    for (int end = it.next(); end != BreakIterator.DONE; start = end, end = it.next()) {
      String sentence = text.substring(start, end).strip();
      while (sentence.codePointCount(0, sentence.length()) > MAX_LENGTH) {
        int limit = sentence.offsetByCodePoints(0, MAX_LENGTH);
        int cut = sentence.lastIndexOf(' ', limit);
        if (cut <= 0) {
          sentences.add(sentence.substring(0, limit));
          sentence = sentence.substring(limit).strip();
        } else {
          sentences.add(sentence.substring(0, cut));
          sentence = sentence.substring(cut + 1);
        }
      }
      if (!sentence.isEmpty()) {
        sentences.add(sentence);
      }
    }
    return sentences;
  }

  /** Every run of white space as one space (U+0020), ends trimmed. */
  static String collapse(String text) {
    StringBuilder sb = new StringBuilder(text.length());
    boolean pendingSpace = false;
    for (int i = 0; i < text.length(); ) {
      int cp = text.codePointAt(i);
      i += Character.charCount(cp);
      if (Character.isWhitespace(cp) || Character.isSpaceChar(cp)) {
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
}
