package reckoner.ops;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import io.fabric8.kubernetes.api.model.ConfigMap;
import io.fabric8.kubernetes.api.model.Container;
import io.fabric8.kubernetes.api.model.ContainerPort;
import io.fabric8.kubernetes.api.model.EnvVar;
import io.fabric8.kubernetes.api.model.HasMetadata;
import io.fabric8.kubernetes.api.model.PodSpec;
import io.fabric8.kubernetes.api.model.Probe;
import io.fabric8.kubernetes.api.model.Quantity;
import io.fabric8.kubernetes.api.model.Service;
import io.fabric8.kubernetes.api.model.Volume;
import io.fabric8.kubernetes.api.model.VolumeMount;
import io.fabric8.kubernetes.api.model.apps.Deployment;
import io.fabric8.kubernetes.api.model.apps.StatefulSet;
import io.fabric8.kubernetes.api.model.autoscaling.v2.HorizontalPodAutoscaler;
import io.fabric8.kubernetes.api.model.policy.v1.PodDisruptionBudget;
import io.fabric8.kubernetes.client.utils.KubernetesSerialization;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import reckoner.config.ServiceConfig;
import reckoner.ledger.LedgerWriter;

/**
 * The Kubernetes manifests, read into fabric8's typed models, against the service itself: the
 * settings they give are settings the service knows and accepts, the ports are the port it
 * listens on, the probes are paths it answers, and the stop takes longer than the ledger's drain.
 */
final class ManifestsTest {
  private static final KubernetesSerialization K8S = new KubernetesSerialization();
  private static List<HasMetadata> app;
  private static List<HasMetadata> postgres;
  private static LiveService service;

  @BeforeAll
  static void read() {
    app = K8S.unmarshal(Repo.read("ops/deploy/reckoner.yaml"));
    postgres = K8S.unmarshal(Repo.read("ops/deploy/postgres.yaml"));
    service = LiveService.start();
  }

  @AfterAll
  static void stop() {
    service.close();
  }

  private static <T extends HasMetadata> T one(List<HasMetadata> objects, Class<T> kind, String name) {
    return objects.stream().filter(kind::isInstance).map(kind::cast).filter(o -> o.getMetadata().getName().equals(name))
        .findFirst().orElseThrow(() -> new AssertionError("no " + kind.getSimpleName() + " " + name));
  }

  private static Deployment deployment() {
    return one(app, Deployment.class, "reckoner");
  }

  private static Container container() {
    List<Container> containers = deployment().getSpec().getTemplate().getSpec().getContainers();
    assertEquals(1, containers.size());
    return containers.get(0);
  }

  /** The settings the pod gets: the ConfigMap's variables, the container's own, secrets as placeholders. */
  private static Map<String, String> environment() {
    Map<String, String> env = new LinkedHashMap<>();
    ConfigMap settings = one(app, ConfigMap.class, container().getEnvFrom().get(0).getConfigMapRef().getName());
    env.putAll(settings.getData());
    for (EnvVar v : container().getEnv()) {
      env.put(v.getName(), v.getValue() != null ? v.getValue() : "from-secret:" + v.getValueFrom().getSecretKeyRef().getKey());
    }
    return env;
  }

  // ---- settings ----

  @Test
  void everyVariable_isASettingOfTheService() {
    Set<String> known = new TreeSet<>();
    ServiceConfig.DEFAULTS.keySet().forEach(s -> known.add(ServiceConfig.envName(s)));
    Set<String> unknown = new TreeSet<>(environment().keySet());
    unknown.removeIf(known::contains);
    assertEquals(Set.of(), unknown, "variables that no setting reads (ServiceConfig.DEFAULTS)");
  }

  @Test
  void settings_areAcceptedByTheService() {
    Map<String, String> settings = new LinkedHashMap<>();
    for (String name : ServiceConfig.DEFAULTS.keySet()) {
      String value = environment().get(ServiceConfig.envName(name));
      if (value != null) {
        settings.put(name, value);
      }
    }
    settings.put("ledger-url", "jdbc:postgresql://reckoner-postgres.reckoner.svc:5432/reckoner"); // as ops/deploy/README.md makes it
    ServiceConfig config = ServiceConfig.from(settings);
    assertEquals("postgresql", config.ledger(), "replicas share one PostgreSQL ledger");
    assertEquals("0.0.0.0", config.host());
  }

  @Test
  void ledgerConnection_comesFromTheSecret() {
    Map<String, String> env = environment();
    assertEquals("from-secret:ledger-url", env.get("RECKONER_LEDGER_URL"));
    assertEquals("from-secret:ledger-user", env.get("RECKONER_LEDGER_USER"));
    assertEquals("from-secret:ledger-password", env.get("RECKONER_LEDGER_PASSWORD"));
    for (EnvVar v : container().getEnv()) {
      assertEquals("reckoner-ledger", v.getValueFrom().getSecretKeyRef().getName(), v.getName());
    }
  }

  @Test
  void keysFile_isMountedFromASecret() {
    String keysFile = environment().get(ServiceConfig.envName("keys-file"));
    assertNotNull(keysFile, "the keys file setting");
    VolumeMount mount = container().getVolumeMounts().stream().filter(m -> keysFile.startsWith(m.getMountPath() + "/"))
        .findFirst().orElseThrow(() -> new AssertionError("no volume is mounted where " + keysFile + " is"));
    assertTrue(mount.getReadOnly());
    Volume volume = volume(mount.getName());
    assertEquals("reckoner-keys", volume.getSecret().getSecretName());
    assertEquals(keysFile.substring(mount.getMountPath().length() + 1), volume.getSecret().getItems().get(0).getPath());
    assertFalse(String.join(" ", container().getArgs()).contains("open-access"), "no open access: callers need keys");
  }

  private static Volume volume(String name) {
    return deployment().getSpec().getTemplate().getSpec().getVolumes().stream().filter(v -> v.getName().equals(name))
        .findFirst().orElseThrow();
  }

  // ---- ports and probes ----

  @Test
  void containerPort_isThePortTheServiceListensOn() {
    ContainerPort port = container().getPorts().get(0);
    assertEquals("http", port.getName());
    assertEquals(Integer.parseInt(environment().get("RECKONER_PORT")), port.getContainerPort());
    assertEquals(ServiceConfig.DEFAULTS.get("port"), port.getContainerPort().toString());
    for (String name : List.of("reckoner", "reckoner-pods")) {
      Service s = one(app, Service.class, name);
      assertEquals("http", s.getSpec().getPorts().get(0).getTargetPort().getStrVal());
      assertEquals(deployment().getSpec().getSelector().getMatchLabels(), s.getSpec().getSelector());
    }
    Matcher expose = Pattern.compile("(?m)^EXPOSE (\\d+)$").matcher(Repo.read("Dockerfile"));
    assertTrue(expose.find());
    assertEquals(port.getContainerPort(), Integer.valueOf(expose.group(1)));
  }

  @Test
  void probes_arePathsTheServiceAnswers() {
    Container c = container();
    for (Probe probe : List.of(c.getStartupProbe(), c.getReadinessProbe(), c.getLivenessProbe())) {
      assertNotNull(probe);
      assertEquals("http", probe.getHttpGet().getPort().getStrVal());
      assertEquals(200, service.get(probe.getHttpGet().getPath()).statusCode(), probe.getHttpGet().getPath());
    }
    assertEquals("/health/ready", c.getReadinessProbe().getHttpGet().getPath(), "readiness follows the ledger");
    assertEquals("/health/live", c.getLivenessProbe().getHttpGet().getPath(), "liveness does not: a database outage restarts nothing");
    Probe startup = c.getStartupProbe();
    assertTrue(startup.getPeriodSeconds() * startup.getFailureThreshold() >= 30, "half a minute at least to start");
  }

  // ---- stopping ----

  @Test
  void gracePeriod_outlastsThePreStopSleepAndTheLedgerDrain() {
    PodSpec pod = deployment().getSpec().getTemplate().getSpec();
    List<String> preStop = container().getLifecycle().getPreStop().getExec().getCommand();
    assertEquals("sleep", preStop.get(0));
    long sleep = Long.parseLong(preStop.get(1));
    assertTrue(sleep >= 5, "the load balancers need a few seconds to drop the pod");
    long drain = LedgerWriter.Settings.defaults().drainTimeout().toSeconds();
    assertTrue(pod.getTerminationGracePeriodSeconds() > sleep + drain,
        pod.getTerminationGracePeriodSeconds() + " s must exceed " + sleep + " s + the ledger's " + drain + " s drain");
  }

  // ---- scaling and disruption ----

  @Test
  void replicas_scaleOnCpu_andADrainKeepsMostUp() {
    Deployment d = deployment();
    HorizontalPodAutoscaler hpa = one(app, HorizontalPodAutoscaler.class, "reckoner");
    assertEquals("Deployment", hpa.getSpec().getScaleTargetRef().getKind());
    assertEquals(d.getMetadata().getName(), hpa.getSpec().getScaleTargetRef().getName());
    assertEquals("cpu", hpa.getSpec().getMetrics().get(0).getResource().getName());
    assertTrue(hpa.getSpec().getMinReplicas() >= 2);
    assertEquals(d.getSpec().getReplicas(), hpa.getSpec().getMinReplicas());
    Map<String, Quantity> requests = container().getResources().getRequests();
    assertNotNull(requests.get("cpu"), "the HPA's utilization is a share of the CPU request");
    assertNotNull(requests.get("memory"));
    PodDisruptionBudget pdb = one(app, PodDisruptionBudget.class, "reckoner");
    assertEquals(d.getSpec().getSelector().getMatchLabels(), pdb.getSpec().getSelector().getMatchLabels());
    assertEquals(1, pdb.getSpec().getMaxUnavailable().getIntVal());
    assertEquals(0, d.getSpec().getStrategy().getRollingUpdate().getMaxUnavailable().getIntVal());
  }

  @Test
  void pods_runAsTheImagesUser_withAReadOnlyRoot() {
    PodSpec pod = deployment().getSpec().getTemplate().getSpec();
    Matcher uid = Pattern.compile("useradd [^\\n]*--uid (\\d+)").matcher(Repo.read("Dockerfile"));
    assertTrue(uid.find());
    assertEquals(Long.valueOf(uid.group(1)), pod.getSecurityContext().getRunAsUser());
    assertTrue(container().getSecurityContext().getReadOnlyRootFilesystem());
  }

  @Test
  void dockerfile_dataVolume_belongsToTheServicesUser() {
    String dockerfile = Repo.read("Dockerfile");
    int chown = dockerfile.indexOf("chown -R reckoner:reckoner /var/lib/reckoner");
    int volume = dockerfile.indexOf("VOLUME [\"/var/lib/reckoner/data\"]");
    assertTrue(chown > 0 && volume > chown, "the data dir is made and given to the user before it is declared a volume");
    assertTrue(dockerfile.contains("mkdir -p /var/lib/reckoner/data"));
    assertFalse(dockerfile.contains("--open-access"));
  }

  @Test
  void prometheus_scrapesEveryPodThroughTheHeadlessService() {
    Service pods = one(app, Service.class, "reckoner-pods");
    assertEquals("None", pods.getSpec().getClusterIP());
    assertTrue(pods.getSpec().getPublishNotReadyAddresses(), "a pod that is not ready must still be scraped");
    String config = Repo.read("ops/prometheus/prometheus-kubernetes.yml");
    assertTrue(config.contains("names: [reckoner-pods." + pods.getMetadata().getNamespace() + ".svc.cluster.local]"));
  }

  // ---- PostgreSQL ----

  @Test
  void postgres_keepsItsDataOnAVolumeClaim() {
    StatefulSet db = one(postgres, StatefulSet.class, "reckoner-postgres");
    String claim = db.getSpec().getVolumeClaimTemplates().get(0).getMetadata().getName();
    Container c = db.getSpec().getTemplate().getSpec().getContainers().get(0);
    assertTrue(c.getVolumeMounts().stream().anyMatch(m -> m.getName().equals(claim)));
    Service s = one(postgres, Service.class, "reckoner-postgres");
    assertEquals(5432, s.getSpec().getPorts().get(0).getPort());
    assertTrue(Repo.read("ops/deploy/README.md")
        .contains("ledger-url=jdbc:postgresql://" + s.getMetadata().getName() + "." + s.getMetadata().getNamespace() + ".svc:5432/reckoner"));
  }
}
