package reckoner;

import java.time.Clock;
import reckoner.call.AnswerCache;
import reckoner.call.Invoker;
import reckoner.config.ConfigException;
import reckoner.config.ServiceConfig;
import reckoner.spec.SpecLoader;
import reckoner.spec.ToolCatalog;
import reckoner.splice.Markup;
import reckoner.tool.ToolRegistry;
import tools.jackson.databind.json.JsonMapper;

/**
 * The call engine that the HTTP service and the offline command line share: the served tools with
 * their specs, the answer cache, the invoker and the configured markup. Wiring only.
 */
record Engine(ToolCatalog catalog, AnswerCache cache, Invoker invoker, Markup markup) {
  static Engine build(ServiceConfig config, Clock clock, JsonMapper json) {
    ToolCatalog catalog = ToolCatalog.of(ToolRegistry.of(Tools.standard()), new SpecLoader(json));
    AnswerCache cache = AnswerCache.ofMaximumSize(config.cacheSize());
    Markup markup;
    try {
      markup = new Markup(config.markupOpen(), config.markupSeparator(), config.markupClose());
    } catch (IllegalArgumentException e) {
      throw new ConfigException("markup-open, markup-separator, markup-close: " + e.getMessage());
    }
    return new Engine(catalog, cache, new Invoker(catalog, clock, cache), markup);
  }

  /** Threads for parallel calls: the configured count, or one per core. */
  static int callThreads(ServiceConfig config) {
    return config.callThreads() == 0 ? Runtime.getRuntime().availableProcessors() : config.callThreads();
  }
}
