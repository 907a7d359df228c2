package reckoner.dates;

import com.ibm.icu.util.ULocale;
import java.util.Collections;
import java.util.IllformedLocaleException;
import java.util.Locale;
import java.util.Set;
import java.util.TreeSet;
import reckoner.tool.ToolException;

/**
 * BCP 47 locale tags for {@code style=long}: well-formed, and of a language for which ICU4J has
 * CLDR data (otherwise ICU would quietly fall back to its root locale). A calendar named in the tag
 * ({@code -u-ca-}) is dropped: the calendar of an answer comes from the {@code calendar} argument
 * alone. Thread-safe.
 */
final class Locales {
  /** The wording locale when {@code style=long} is asked without a locale. */
  static final String DEFAULT_TAG = "en-US";
  private static final Set<String> LANGUAGES = languages();

  private Locales() {}

  private static Set<String> languages() {
    Set<String> languages = new TreeSet<>();
    for (ULocale locale : ULocale.getAvailableLocales()) {
      languages.add(locale.getLanguage());
    }
    languages.remove("");
    return Collections.unmodifiableSet(languages);
  }

  /** The locale of {@code tag} ({@code en_us} is read as {@code en-US}); invalid_argument if unusable. */
  static ULocale of(String tag) throws ToolException {
    String s = tag.strip().replace('_', '-');
    try {
      new Locale.Builder().setLanguageTag(s); // well-formedness by BCP 47, not ICU's lenient reading
    } catch (IllformedLocaleException e) {
      throw Problems.invalidArgument("locale must be a BCP 47 language tag such as en-US or fr-FR but was " + Problems.quote(tag));
    }
    ULocale locale = ULocale.forLanguageTag(s).setKeywordValue("calendar", null);
    if (!LANGUAGES.contains(locale.getLanguage())) {
      throw Problems.invalidArgument("no CLDR wording for the language of " + Problems.quote(tag)
          + "; give a language ICU knows, such as en, fr, de, ar, hi, ja");
    }
    return locale;
  }

  /** The canonical spelling of a valid tag: {@code en-us} is {@code en-US}. */
  static String canonical(String tag) throws ToolException {
    return of(tag).toLanguageTag();
  }
}
