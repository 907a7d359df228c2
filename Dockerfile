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

# Run stage: a JRE, the jar, and an unprivileged user.
FROM eclipse-temurin:17-jre
RUN apt-get update -qq && apt-get install -y -qq --no-install-recommends curl && rm -rf /var/lib/apt/lists/* \
 && useradd --system --uid 10001 --home-dir /var/lib/reckoner --create-home reckoner
COPY --from=build /src/service/target/reckoner.jar /opt/reckoner/reckoner.jar
USER reckoner
WORKDIR /var/lib/reckoner
VOLUME ["/var/lib/reckoner/data"]
EXPOSE 8080
ENV JAVA_TOOL_OPTIONS="-XX:MaxRAMPercentage=75 -XX:+ExitOnOutOfMemoryError"
# Until API keys are configured the service serves loopback only; inside a container the port is
# published, so the open-access opt-in is explicit here. Put it behind an authenticating proxy.
HEALTHCHECK --interval=10s --timeout=3s --start-period=20s --retries=3 \
  CMD curl -fsS http://127.0.0.1:8080/health/ready || exit 1
ENTRYPOINT ["java", "-jar", "/opt/reckoner/reckoner.jar"]
CMD ["serve", "--host", "0.0.0.0", "--port", "8080", "--data-dir", "/var/lib/reckoner/data", "--open-access"]
