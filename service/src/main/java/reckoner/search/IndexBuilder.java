package reckoner.search;

import java.io.IOException;
import java.util.List;
import java.util.Map;
import org.apache.lucene.document.Document;
import org.apache.lucene.document.Field;
import org.apache.lucene.document.IntPoint;
import org.apache.lucene.document.NumericDocValuesField;
import org.apache.lucene.document.SortedDocValuesField;
import org.apache.lucene.document.StoredField;
import org.apache.lucene.document.TextField;
import org.apache.lucene.index.IndexWriter;
import org.apache.lucene.index.IndexWriterConfig;
import org.apache.lucene.search.Sort;
import org.apache.lucene.search.SortField;
import org.apache.lucene.store.Directory;
import org.apache.lucene.util.BytesRef;
import reckoner.data.ContentDigest;

/**
 * Writes one collection's passages into a new Lucene index: documents in any order, the index
 * sorted by document id and passage position, merged into one segment, committed with the
 * collection's data version and document count. Single use; not thread-safe.
 */
final class IndexBuilder implements AutoCloseable {
  /** Commit data: the collection's data version, to check an index found on disk. */
  static final String VERSION_KEY = "reckoner.data_version";
  /** Commit data: how many documents the index holds. */
  static final String DOCUMENTS_KEY = "reckoner.documents";

  private final IndexWriter writer;
  private final ContentDigest digest;
  private int documents;

  IndexBuilder(String name, Language language, Directory directory) throws IOException {
    IndexWriterConfig config = new IndexWriterConfig(language.analyzer())
        .setOpenMode(IndexWriterConfig.OpenMode.CREATE)
        .setSimilarity(Collection.similarity())
        .setIndexSort(new Sort(new SortField(SearchFields.ID, SortField.Type.STRING),
            new SortField(SearchFields.POSITION, SortField.Type.LONG)))
        .setRAMBufferSizeMB(32)
        .setCommitOnClose(false);
    this.writer = new IndexWriter(directory, config);
    this.digest = SearchFormat.newDigest(name);
  }

  /** Adds every passage of {@code doc}; the digest of everything added so far grows by it. */
  void add(SearchFormat.Doc doc) throws IOException {
    SearchFormat.digest(digest, doc);
    documents++;
    List<String> passages = Passages.of(doc.title(), doc.text());
    BytesRef id = new BytesRef(doc.id());
    int day = doc.date() == null ? Integer.MIN_VALUE : Collection.day(doc.date());
    for (int position = 0; position < passages.size(); position++) {
      Document d = new Document();
      d.add(new TextField(SearchFields.BODY, passages.get(position), Field.Store.NO));
      d.add(new StoredField(SearchFields.TEXT, passages.get(position)));
      d.add(new SortedDocValuesField(SearchFields.ID, id));
      d.add(new StoredField(SearchFields.ID, doc.id()));
      d.add(new NumericDocValuesField(SearchFields.POSITION, position));
      d.add(new StoredField(SearchFields.POSITION, position));
      d.add(new IntPoint(SearchFields.DAY, day));
      writer.addDocument(d);
    }
  }

  /** The data version of what was added, given the collection's language (declared after the documents, if at all). */
  String version(Language language) {
    return SearchFormat.finish(digest, language);
  }

  int documents() {
    return documents;
  }

  /** Merges into one segment and commits, recording {@code version} and the document count. */
  void commit(String version) throws IOException {
    writer.forceMerge(1);
    writer.setLiveCommitData(Map.of(VERSION_KEY, version, DOCUMENTS_KEY, Integer.toString(documents)).entrySet());
    writer.commit();
  }

  @Override
  public void close() throws IOException {
    writer.close();
  }
}
