package reckoner.search;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicInteger;
import org.apache.lucene.analysis.Analyzer;
import org.apache.lucene.document.Document;
import org.apache.lucene.document.IntPoint;
import org.apache.lucene.index.DirectoryReader;
import org.apache.lucene.index.StoredFields;
import org.apache.lucene.index.Term;
import org.apache.lucene.search.BooleanClause;
import org.apache.lucene.search.BooleanQuery;
import org.apache.lucene.search.IndexSearcher;
import org.apache.lucene.search.ScoreDoc;
import org.apache.lucene.search.TermQuery;
import org.apache.lucene.search.TopDocs;
import org.apache.lucene.search.similarities.BM25Similarity;
import org.apache.lucene.store.Directory;
import reckoner.data.Dataset;

/**
 * One loaded collection: its name, language, content digest and a Lucene index of its passages,
 * searched with BM25. The index is one segment sorted by document id (UTF-8 byte order) and
 * passage position, so Lucene's tie rule (the lower document number first) puts equal scores in
 * that order. Immutable and thread-safe. Calls {@link #acquire} the collection before searching
 * and {@link #releaseCall} it after, so a reload that drops it closes the index only once no call
 * uses it.
 */
final class Collection implements Dataset {
  /** BM25's term frequency saturation. */
  static final float K1 = 1.2f;
  /** BM25's length normalisation. */
  static final float B = 0.75f;

  /** One scored passage. */
  record Hit(float score, String id, int position, String text) {}

  private final String name;
  private final Language language;
  private final String version;
  private final int documents;
  private final long passages;
  private final boolean onDisk;
  private final Analyzer analyzer;
  private final Directory directory;
  private final DirectoryReader reader;
  private final IndexSearcher searcher;
  private final AtomicInteger calls = new AtomicInteger(1); // 1: held by the store until released
  private final AtomicBoolean released = new AtomicBoolean();

  Collection(String name, Language language, String version, int documents, boolean onDisk, Analyzer analyzer,
      Directory directory) throws IOException {
    this.name = name;
    this.language = language;
    this.version = version;
    this.documents = documents;
    this.onDisk = onDisk;
    this.analyzer = analyzer;
    this.directory = directory;
    this.reader = DirectoryReader.open(directory);
    this.passages = reader.numDocs();
    this.searcher = new IndexSearcher(reader);
    this.searcher.setSimilarity(similarity());
    this.searcher.setQueryCache(null); // every answer computed the same way; no cache warming up differently
  }

  static BM25Similarity similarity() {
    return new BM25Similarity(K1, B, true);
  }

  String name() {
    return name;
  }

  Language language() {
    return language;
  }

  @Override
  public String version() {
    return version;
  }

  /** How many documents the collection holds. */
  @Override
  public int records() {
    return documents;
  }

  long passages() {
    return passages;
  }

  boolean isOnDisk() {
    return onDisk;
  }

  Analyzer analyzer() {
    return analyzer;
  }

  /** The best passage for {@code terms} among documents dated on or before {@code asOf} (undated ones always). */
  Optional<Hit> best(List<String> terms, Optional<LocalDate> asOf) {
    List<Hit> hits = top(terms, asOf, 1);
    return hits.isEmpty() ? Optional.empty() : Optional.of(hits.get(0));
  }

  /** The {@code n} best passages, best first, ties by document id and position. */
  List<Hit> top(List<String> terms, Optional<LocalDate> asOf, int n) {
    BooleanQuery.Builder query = new BooleanQuery.Builder();
    for (String term : new java.util.LinkedHashSet<>(terms)) { // each distinct term once
      query.add(new TermQuery(new Term(SearchFields.BODY, term)), BooleanClause.Occur.SHOULD);
    }
    asOf.ifPresent(d -> query.add(IntPoint.newRangeQuery(SearchFields.DAY, Integer.MIN_VALUE, day(d)), BooleanClause.Occur.FILTER));
    try {
      TopDocs top = searcher.search(query.build(), n);
      StoredFields stored = searcher.storedFields();
      List<Hit> hits = new ArrayList<>(top.scoreDocs.length);
      for (ScoreDoc sd : top.scoreDocs) {
        Document d = stored.document(sd.doc);
        hits.add(new Hit(sd.score, d.get(SearchFields.ID), d.getField(SearchFields.POSITION).numericValue().intValue(),
            d.get(SearchFields.TEXT)));
      }
      return hits;
    } catch (IOException e) {
      throw new UncheckedIOException("the index of collection " + name + " could not be read", e);
    }
  }

  /** Days since 1970-01-01, clamped to an int: documents are dated within years 1 to 9999, far inside it. */
  static int day(LocalDate date) {
    return (int) Math.max(Integer.MIN_VALUE + 1L, Math.min(Integer.MAX_VALUE, date.toEpochDay()));
  }

  /** Takes the collection for one call; false if it was released meanwhile (read the snapshot again). */
  boolean acquire() {
    for (int n = calls.get(); n > 0; n = calls.get()) {
      if (calls.compareAndSet(n, n + 1)) {
        return true;
      }
    }
    return false;
  }

  /** Ends one call's use. */
  void releaseCall() {
    if (calls.decrementAndGet() == 0) {
      close();
    }
  }

  /** The store stops serving the collection: its index closes when the last call ends. */
  @Override
  public void release() {
    if (released.compareAndSet(false, true)) {
      releaseCall();
    }
  }

  private void close() {
    try {
      reader.close();
      directory.close();
    } catch (IOException e) {
      throw new UncheckedIOException("closing the index of collection " + name, e);
    }
  }
}
