package reckoner;

import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.Map;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Model.OptionSpec;
import reckoner.config.ServiceConfig;

/**
 * One command-line flag per setting of {@link ServiceConfig#SETTINGS}, made from that list, so a
 * new setting is a flag the moment it exists: {@code --NAME VALUE}; a boolean also as {@code --NAME}
 * alone or {@code --no-NAME}; a list setting ({@code facts-dirs}) as its singular, repeatable
 * ({@code --facts-dir DIR --facts-dir DIR}).
 */
final class SettingFlags {
  private SettingFlags() {}

  /** Adds the flags of every setting {@code serve} takes ({@code forServe}), or of those {@code fill} takes. */
  static void addTo(CommandSpec command, boolean forServe) {
    for (ServiceConfig.Setting s : ServiceConfig.SETTINGS) {
      if (s.serveOnly() && !forServe) {
        continue;
      }
      OptionSpec.Builder option;
      if (isList(s)) {
        option = OptionSpec.builder(flag(s)).type(String[].class).arity("1").paramLabel("DIR");
      } else if (isBoolean(s)) {
        option = OptionSpec.builder(flag(s)).type(Boolean.class).arity("0..1").fallbackValue("true").negatable(true).paramLabel("true|false");
      } else {
        option = OptionSpec.builder(flag(s)).type(String.class).arity("1").paramLabel("VALUE");
      }
      command.addOption(option.description(s.meaning() + (s.defaultValue().isEmpty() ? "" : " (default " + s.defaultValue() + ")"))
          .build());
    }
  }

  /**
   * The settings: flags given on the command line, over {@code RECKONER_*} variables of
   * {@code env}, over the properties file ({@code configFile}, else {@code RECKONER_CONFIG}),
   * over the defaults. Fails with {@link reckoner.config.ConfigException} naming a bad setting.
   */
  static ServiceConfig resolve(CommandSpec command, Path configFile, Map<String, String> env) {
    Map<String, String> flags = new LinkedHashMap<>();
    for (ServiceConfig.Setting s : ServiceConfig.SETTINGS) {
      OptionSpec option = command.findOption(flag(s));
      if (option == null || !command.commandLine().getParseResult().hasMatchedOption(option)) {
        continue;
      }
      Object value = option.getValue();
      flags.put(s.name(), value instanceof String[] list ? String.join(",", list) : String.valueOf(value));
    }
    Path file = configFile != null ? configFile : env.get("RECKONER_CONFIG") != null ? Path.of(env.get("RECKONER_CONFIG")) : null;
    return ServiceConfig.from(ServiceConfig.merge(file, env, flags));
  }

  /** {@code --data-dir}; a list setting's flag is singular: {@code facts-dirs} is {@code --facts-dir}. */
  static String flag(ServiceConfig.Setting s) {
    return "--" + (isList(s) ? s.name().substring(0, s.name().length() - 1) : s.name());
  }

  private static boolean isList(ServiceConfig.Setting s) {
    return s.name().endsWith("-dirs");
  }

  private static boolean isBoolean(ServiceConfig.Setting s) {
    return s.defaultValue().equals("true") || s.defaultValue().equals("false");
  }
}
