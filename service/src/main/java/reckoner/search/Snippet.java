package reckoner.search;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import org.apache.lucene.analysis.Analyzer;
import org.apache.lucene.analysis.TokenStream;
import org.apache.lucene.analysis.tokenattributes.CharTermAttribute;
import org.apache.lucene.analysis.tokenattributes.OffsetAttribute;

/**
 * The answer's line: a passage cut to at most {@link #MAX_LENGTH} characters around the query's
 * terms. A passage that fits is the answer whole. Otherwise the passage is analyzed as at indexing,
 * its words whose terms are query terms are found, and the span of them that holds the most
 * distinct query terms within {@link #WINDOW} characters is chosen (ties: the earliest). A window
 * of {@link #WINDOW} characters is centred on that span and kept inside the passage; a cut end
 * then moves to the nearest space inside the window (outside the span), and is marked with
 * {@code …}. {@code <} and {@code >} are shown as {@code ‹} and {@code ›}, so that no splice
 * delimiter can form. Pure functions; thread-safe.
 */
final class Snippet {
  /** The contract's bound on an answer, in characters. */
  static final int MAX_LENGTH = 200;
  /** The passage text kept when it must be cut: room for an ellipsis at either end. */
  static final int WINDOW = MAX_LENGTH - 2;

  private Snippet() {}

  /** A query term's place in the passage, in UTF-16 offsets. */
  private record Match(int start, int end, String term) {}

  static String of(String passage, Set<String> terms, Analyzer analyzer) {
    String text = passage.replace('<', '‹').replace('>', '›');
    if (text.codePointCount(0, text.length()) <= MAX_LENGTH) {
      return text;
    }
    List<Match> matches = matches(text, terms, analyzer);
    int spanStart = 0;
    int spanEnd = 0;
    int bestDistinct = 0;
    for (int i = 0; i < matches.size(); i++) {
      Set<String> seen = new HashSet<>();
      int end = matches.get(i).start();
      for (int j = i; j < matches.size() && matches.get(j).end() - matches.get(i).start() <= WINDOW; j++) {
        seen.add(matches.get(j).term());
        end = matches.get(j).end();
      }
      if (seen.size() > bestDistinct) {
        bestDistinct = seen.size();
        spanStart = matches.get(i).start();
        spanEnd = end;
      }
    }
    int start = Math.max(0, Math.min((spanStart + spanEnd) / 2 - WINDOW / 2, text.length() - WINDOW));
    int end = start + WINDOW;
    if (start > 0) {
      int space = text.indexOf(' ', start);
      if (space >= 0 && space < spanStart) {
        start = space + 1;
      } else if (Character.isLowSurrogate(text.charAt(start))) {
        start++;
      }
    }
    if (end < text.length()) {
      int space = text.lastIndexOf(' ', end);
      if (space >= Math.max(spanEnd, start + 1)) {
        end = space;
      } else if (Character.isHighSurrogate(text.charAt(end - 1))) {
        end--;
      }
    }
    String cut = text.substring(start, end).strip();
    return (start > 0 ? "…" : "") + cut + (end < text.length() ? "…" : "");
  }

  private static List<Match> matches(String text, Set<String> terms, Analyzer analyzer) {
    List<Match> matches = new ArrayList<>();
    try (TokenStream stream = analyzer.tokenStream(SearchFields.BODY, text)) {
      CharTermAttribute term = stream.addAttribute(CharTermAttribute.class);
      OffsetAttribute offset = stream.addAttribute(OffsetAttribute.class);
      stream.reset();
      while (stream.incrementToken()) {
        String t = term.toString();
        if (terms.contains(t)) {
          matches.add(new Match(offset.startOffset(), offset.endOffset(), t));
        }
      }
      stream.end();
    } catch (IOException e) {
      throw new UncheckedIOException("analysing a string cannot fail", e); // no I/O: the reader is a string
    }
    return matches;
  }
}
