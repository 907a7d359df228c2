package reckoner.http;

import static io.restassured.RestAssured.given;
import static org.hamcrest.Matchers.equalTo;
import static org.hamcrest.Matchers.startsWith;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import io.restassured.response.Response;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/** search@1 over HTTP: answers, hostile queries (4xx or not_found, never 5xx), and the collection administration. */
final class SearchRoutesTest {
  private static TestServer server;

  @BeforeAll
  static void start() {
    server = TestServer.start();
  }

  @AfterAll
  static void stop() {
    server.close();
  }

  private static Response search(String body) {
    return given().port(server.port()).contentType("application/json").accept("text/plain").body(body)
        .post("/v1/tools/search/1/invoke");
  }

  @Test
  void invoke_demoQuery_answersThePassageWithItsDataVersion() {
    given().port(server.port()).contentType("application/json").body("{\"query\":\"largest lake\"}")
        .post("/v1/tools/search/1/invoke").then().statusCode(200)
        .body("text", startsWith("Fernhallow Mere: Fernhallow Mere, 3.1 km², is the largest lake"))
        .body("data_version", equalTo("sha256:52be1fa53fa29bb5"));
  }

  @ParameterizedTest
  @ValueSource(strings = {
      "{\"query\":\"title:bridge AND (gannet OR seal*)~2 ^3 [a TO z] /re.ex/\"}",
      "{\"query\":\"the of and\"}",
      "{\"query\":\"\\u0000\\u001b[2J\"}",
      "{\"query\":\"bridge\\ud800\"}",
      "{\"query\":\"   \"}",
      "{\"query\":\"%s\"}",
      "{\"text\":\"%s\"}"})
  void invoke_hostileQuery_isA4xxOrAnAnswer_neverA5xx(String template) {
    String body = template.contains("%s") ? String.format(template, "tide ".repeat(200)) : template;
    Response r = search(body);
    assertTrue(r.statusCode() < 500, r.statusCode() + " " + r.asString());
    assertTrue(r.statusCode() == 200 || r.header("Reckoner-Error-Code") != null, r.asString());
    search("{\"query\":\"puffins\"}").then().statusCode(200).body(startsWith("Atlantic puffin:"));
  }

  @Test
  void invoke_hugeQuery_isRefusedByTheBodyLimit() {
    Response r = search("{\"query\":\"" + "x".repeat(70_000) + "\"}");
    assertEquals(413, r.statusCode(), r.asString());
  }

  @Test
  void admin_showsTheCollections_andReloadsFilesDroppedIn() throws IOException {
    given().port(server.port()).get("/v1/admin/search").then().statusCode(200)
        .body("default_collection", equalTo("demo"))
        .body("collections.demo.data_version", equalTo("sha256:52be1fa53fa29bb5"))
        .body("collections.demo.documents", equalTo(254))
        .body("collections.demo.language", equalTo("en"))
        .body("collections.demo.index", equalTo("memory"));
    Path own = server.dataDir().resolve("search");
    Files.writeString(own.resolve("notes.jsonl"),
        "{\"collection\":\"notes\",\"id\":\"1\",\"title\":\"Kelp\",\"text\":\"Kelp is dried on the Saltmarrow shore.\"}\n",
        StandardCharsets.UTF_8);
    given().port(server.port()).post("/v1/admin/search/reload").then().statusCode(200)
        .body("applied", equalTo(true))
        .body("collections.find { it.collection == 'notes' }.changed", equalTo(true));
    search("{\"query\":\"kelp dried\",\"collection\":\"notes\"}").then().statusCode(200)
        .body(equalTo("Kelp: Kelp is dried on the Saltmarrow shore."));

    Files.writeString(own.resolve("notes.jsonl"), "{\"collection\":\"notes\",\"id\":\"1\"}\n", StandardCharsets.UTF_8);
    given().port(server.port()).post("/v1/admin/search/reload").then().statusCode(422)
        .header("Reckoner-Error-Code", "data_error")
        .body("code", equalTo("data_error"))
        .body("applied", equalTo(false))
        .body("detail", startsWith("1 problem(s) in the collection files; first: " + own.resolve("notes.jsonl") + ":1: \"title\" is missing"));
    search("{\"query\":\"kelp dried\",\"collection\":\"notes\"}").then().statusCode(200)
        .body(equalTo("Kelp: Kelp is dried on the Saltmarrow shore."));
    Files.delete(own.resolve("notes.jsonl"));
    given().port(server.port()).post("/v1/admin/search/reload").then().statusCode(200);
  }
}
