package reckoner.search;

import java.util.Arrays;
import java.util.Locale;
import java.util.Optional;
import java.util.function.Function;
import org.apache.lucene.analysis.Analyzer;
import org.apache.lucene.analysis.CharArraySet;
import org.apache.lucene.analysis.LowerCaseFilter;
import org.apache.lucene.analysis.StopFilter;
import org.apache.lucene.analysis.TokenStream;
import org.apache.lucene.analysis.Tokenizer;
import org.apache.lucene.analysis.da.DanishAnalyzer;
import org.apache.lucene.analysis.de.GermanAnalyzer;
import org.apache.lucene.analysis.en.EnglishAnalyzer;
import org.apache.lucene.analysis.en.EnglishPossessiveFilter;
import org.apache.lucene.analysis.en.PorterStemFilter;
import org.apache.lucene.analysis.es.SpanishAnalyzer;
import org.apache.lucene.analysis.fi.FinnishAnalyzer;
import org.apache.lucene.analysis.fr.FrenchAnalyzer;
import org.apache.lucene.analysis.it.ItalianAnalyzer;
import org.apache.lucene.analysis.nl.DutchAnalyzer;
import org.apache.lucene.analysis.no.NorwegianAnalyzer;
import org.apache.lucene.analysis.pt.PortugueseAnalyzer;
import org.apache.lucene.analysis.snowball.SnowballFilter;
import org.apache.lucene.analysis.standard.StandardTokenizer;
import org.apache.lucene.analysis.sv.SwedishAnalyzer;
import org.tartarus.snowball.ext.DanishStemmer;
import org.tartarus.snowball.ext.DutchStemmer;
import org.tartarus.snowball.ext.FinnishStemmer;
import org.tartarus.snowball.ext.FrenchStemmer;
import org.tartarus.snowball.ext.GermanStemmer;
import org.tartarus.snowball.ext.ItalianStemmer;
import org.tartarus.snowball.ext.NorwegianStemmer;
import org.tartarus.snowball.ext.PortugueseStemmer;
import org.tartarus.snowball.ext.SpanishStemmer;
import org.tartarus.snowball.ext.SwedishStemmer;

/**
 * A collection's language, which picks its analyzer: Lucene's {@code StandardTokenizer} (the word
 * boundaries of Unicode UAX #29, tokens of at most 255 characters), then for English the removal
 * of a trailing {@code 's}, then {@code LowerCaseFilter} (case folding by {@code
 * Character.toLowerCase}, the same in every locale), then the language's stop words, then its
 * stemmer: Porter's for English, the Snowball stemmer of the language otherwise. {@code none}
 * tokenizes and folds case only. Immutable.
 */
enum Language {
  NONE("none", null, null),
  EN("en", EnglishAnalyzer.ENGLISH_STOP_WORDS_SET, PorterStemFilter::new),
  DA("da", DanishAnalyzer.getDefaultStopSet(), in -> new SnowballFilter(in, new DanishStemmer())),
  DE("de", GermanAnalyzer.getDefaultStopSet(), in -> new SnowballFilter(in, new GermanStemmer())),
  ES("es", SpanishAnalyzer.getDefaultStopSet(), in -> new SnowballFilter(in, new SpanishStemmer())),
  FI("fi", FinnishAnalyzer.getDefaultStopSet(), in -> new SnowballFilter(in, new FinnishStemmer())),
  FR("fr", FrenchAnalyzer.getDefaultStopSet(), in -> new SnowballFilter(in, new FrenchStemmer())),
  IT("it", ItalianAnalyzer.getDefaultStopSet(), in -> new SnowballFilter(in, new ItalianStemmer())),
  NL("nl", DutchAnalyzer.getDefaultStopSet(), in -> new SnowballFilter(in, new DutchStemmer())),
  NO("no", NorwegianAnalyzer.getDefaultStopSet(), in -> new SnowballFilter(in, new NorwegianStemmer())),
  PT("pt", PortugueseAnalyzer.getDefaultStopSet(), in -> new SnowballFilter(in, new PortugueseStemmer())),
  SV("sv", SwedishAnalyzer.getDefaultStopSet(), in -> new SnowballFilter(in, new SwedishStemmer()));

  /** The language of a collection that declares none. */
  static final Language DEFAULT = EN;

  private final String tag;
  private final CharArraySet stopWords;
  private final Function<TokenStream, TokenStream> stemmer;

  Language(String tag, CharArraySet stopWords, Function<TokenStream, TokenStream> stemmer) {
    this.tag = tag;
    this.stopWords = stopWords;
    this.stemmer = stemmer;
  }

  /** The BCP 47 primary language subtag, or {@code none}. */
  String tag() {
    return tag;
  }

  static Optional<Language> of(String tag) {
    return Arrays.stream(values()).filter(l -> l.tag.equals(tag)).findFirst();
  }

  /** The tags, in declaration order, for messages. */
  static String tags() {
    return String.join(", ", Arrays.stream(values()).map(Language::tag).toList());
  }

  /** A new analyzer for this language; thread-safe, as Lucene analyzers are. */
  Analyzer analyzer() {
    return new Analyzer() {
      @Override
      protected TokenStreamComponents createComponents(String fieldName) {
        Tokenizer source = new StandardTokenizer();
        TokenStream stream = source;
        if (Language.this == EN) {
          stream = new EnglishPossessiveFilter(stream);
        }
        stream = new LowerCaseFilter(stream);
        if (stopWords != null) {
          stream = new StopFilter(stream, stopWords);
        }
        if (stemmer != null) {
          stream = stemmer.apply(stream);
        }
        return new TokenStreamComponents(source, stream);
      }
    };
  }

  @Override
  public String toString() {
    return tag.toLowerCase(Locale.ROOT);
  }
}
