package reckoner.ops;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import reckoner.config.ServiceConfig;
import reckoner.ledger.LedgerWriter;

/** The systemd unit for one host, checked by systemd's own {@code systemd-analyze verify}. */
final class SystemdUnitIT {
  @Test
  void unit_passesSystemdAnalyzeVerify_withoutAWord() {
    Path analyze = Repo.program("/usr/bin/systemd-analyze", "systemd");
    External r = External.run(Repo.root(), null, analyze.toString(), "verify", Repo.file("ops/systemd/reckoner.service").toString());
    assertEquals(0, r.exitCode(), r.output());
    assertEquals("", r.output().strip(), "a warning (an unknown key, a bad value) is a failure too");
  }

  @Test
  void unit_settingsAreTheServices_andTheStopOutlastsTheDrain() {
    String unit = Repo.read("ops/systemd/reckoner.service");
    Matcher env = Pattern.compile("RECKONER_[A-Z_]+").matcher(unit + Repo.read("ops/systemd/reckoner.env"));
    while (env.find()) {
      String name = env.group();
      assertTrue(ServiceConfig.DEFAULTS.keySet().stream().anyMatch(s -> ServiceConfig.envName(s).equals(name)), name);
    }
    assertTrue(unit.contains("RECKONER_LEDGER=sqlite"));
    Matcher stop = Pattern.compile("(?m)^TimeoutStopSec=(\\d+)$").matcher(unit);
    assertTrue(stop.find());
    assertTrue(Long.parseLong(stop.group(1)) > LedgerWriter.Settings.defaults().drainTimeout().toSeconds());
    assertTrue(unit.contains("SuccessExitStatus=143"), "the JVM exits 143 after a SIGTERM it handled");
  }
}
