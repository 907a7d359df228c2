package reckoner.search;

/** The fields of a passage in a collection's Lucene index. */
final class SearchFields {
  /** The analyzed text searched: the passage with its title in front (not stored). */
  static final String BODY = "body";
  /** The passage as shown (stored). */
  static final String TEXT = "text";
  /** The document's id (stored, and sorted doc values: the index's order). */
  static final String ID = "id";
  /** The passage's position in its document, from 0 (stored, and numeric doc values: the index's order). */
  static final String POSITION = "pos";
  /** The document's date as days since 1970-01-01, {@link Integer#MIN_VALUE} when undated (points: the as_of filter). */
  static final String DAY = "day";

  private SearchFields() {}
}
