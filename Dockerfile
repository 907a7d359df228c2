# syntax=docker/dockerfile:1
# Build stage: compile and package the shaded jar with Maven on JDK 17.
FROM maven:3.9-eclipse-temurin-17 AS build
WORKDIR /src
COPY pom.xml ./
COPY service/pom.xml service/
RUN mvn -B -q -f service/pom.xml dependency:go-offline || true
COPY service service
COPY tool-specs tool-specs
RUN mvn -B -q -DskipTests package

# Run stage: a JRE, the jar, and an unprivileged user (uid 10001, as ops/deploy/reckoner.yaml runs it).
FROM eclipse-temurin:17-jre
RUN apt-get update -qq && apt-get install -y -qq --no-install-recommends curl && rm -rf /var/lib/apt/lists/* \
 && groupadd --system --gid 10001 reckoner \
 && useradd --system --uid 10001 --gid reckoner --home-dir /var/lib/reckoner --create-home reckoner \
 && mkdir -p /var/lib/reckoner/data /etc/reckoner/keys \
 && chown -R reckoner:reckoner /var/lib/reckoner
COPY --from=build /src/service/target/reckoner.jar /opt/reckoner/reckoner.jar
# A class-data archive of what a start and a few calls load (ops/class-archive.sh): a JVM of this
# image maps it instead of loading those classes again, about 1.7 s less to ready on 2 cores.
COPY ops/class-archive.sh /opt/reckoner/class-archive.sh
RUN /opt/reckoner/class-archive.sh /opt/reckoner/reckoner.jar /opt/reckoner/reckoner.jsa
USER reckoner
WORKDIR /var/lib/reckoner
# The data dir exists and belongs to the service's user before it becomes a volume, so a new
# volume starts out writable by it.
VOLUME ["/var/lib/reckoner/data"]
EXPOSE 8080
# Settings as RECKONER_* variables (README: Settings). The API keys file is mounted at
# /etc/reckoner/keys/keys.jsonl (a Kubernetes Secret, or docker run -v ...:/etc/reckoner/keys:ro).
# Heap: a third of the container's memory limit (256 MiB of the manifests' 768 MiB). Measured under
# the mixed load of load-tests/open-load: the live heap after a full GC is about 60 MiB with a full
# answer cache; the rest of the limit is for metaspace, code, threads, SQLite and Lucene's mapped files.
ENV JAVA_TOOL_OPTIONS="-XX:MaxRAMPercentage=33 -XX:SharedArchiveFile=/opt/reckoner/reckoner.jsa -XX:+ExitOnOutOfMemoryError" \
    RECKONER_HOST=0.0.0.0 \
    RECKONER_PORT=8080 \
    RECKONER_DATA_DIR=/var/lib/reckoner/data \
    RECKONER_KEYS_FILE=/etc/reckoner/keys/keys.jsonl
HEALTHCHECK --interval=10s --timeout=3s --start-period=20s --retries=3 \
  CMD curl -fsS http://127.0.0.1:8080/health/ready || exit 1
# SIGTERM (docker stop): finish requests in flight and drain the ledger; give it time (docker stop -t 60).
STOPSIGNAL SIGTERM
ENTRYPOINT ["java", "-jar", "/opt/reckoner/reckoner.jar"]
CMD ["serve"]
