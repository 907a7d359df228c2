package reckoner.http;

import static io.restassured.RestAssured.given;
import static org.hamcrest.Matchers.equalTo;
import static org.hamcrest.Matchers.nullValue;
import static org.junit.jupiter.api.Assertions.assertEquals;

import io.restassured.path.json.JsonPath;
import java.nio.charset.StandardCharsets;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * units@2 over HTTP: the reading taken is the answer's {@code reading}; an unpinned call and an
 * unpinned splice get version 2 while version 1 stays served; a text that cannot be read or
 * computed is a 422 with its code, a malformed request a 400.
 */
final class UnitsV2HttpTest {
  private static TestServer server;

  @BeforeAll
  static void start() {
    server = TestServer.start();
  }

  @AfterAll
  static void stop() {
    server.close();
  }

  @Test
  void answer_carriesTheReadingTaken() {
    given().port(server.port()).contentType("application/json").body("{\"text\":\"3 cups to ml\"}")
        .post("/v1/tools/units/2/invoke").then().statusCode(200)
        .body("text", equalTo("709.765 ml"))
        .body("reading", equalTo("'cups' read as US cup (cup_us), the default for system us"));
    given().port(server.port()).contentType("application/json").body("{\"text\":\"5 km to mi\"}")
        .post("/v1/tools/units/2/invoke").then().statusCode(200)
        .body("text", equalTo("3.10686 mi"))
        .body("reading", nullValue());
    given().port(server.port()).contentType("text/plain; charset=UTF-8").accept("text/plain")
        .body("3 cups to ml".getBytes(StandardCharsets.UTF_8)).post("/v1/tools/units/2/invoke").then().statusCode(200)
        .body(equalTo("709.765 ml"));
  }

  @Test
  void unpinnedCalls_getVersion2_andVersion1StaysServed() {
    JsonPath batch = given().port(server.port()).contentType("application/json")
        .body("{\"calls\":[{\"id\":\"a\",\"tool\":\"units\",\"args\":{\"text\":\"1 hp in watts\"}},"
            + "{\"id\":\"b\",\"tool\":\"units\",\"version\":1,\"args\":{\"text\":\"1 hp in watts\"}}]}")
        .post("/v1/batch").then().statusCode(200).extract().jsonPath();
    assertEquals(2, batch.getInt("results[0].version"));
    assertEquals("745.7 watts", batch.getString("results[0].text"));
    assertEquals("'hp' read as mechanical horsepower (hp_mech), the default for system us",
        batch.getString("results[0].reading"));
    assertEquals("ambiguous_unit", batch.getString("results[1].code"));
    given().port(server.port()).contentType("application/json").body("{\"call\":\"units(5 ft 11 in to cm)\"}")
        .post("/v1/splice").then().statusCode(200)
        .body("version", equalTo(2))
        .body("text", equalTo("180.34 cm"));
  }

  @Test
  void unreadableText_is422_andAMalformedRequest400() {
    String[][] cases = {
        {"{\"text\":\"1,250 m to km\"}", "422", "syntax_error"},
        {"{\"text\":\"1 m to ft+cm\"}", "422", "syntax_error"},
        {"{\"text\":\"98.6 F to kg\"}", "422", "dimension_mismatch"},
        {"{\"text\":\"5 km\\u202e to mi\"}", "422", "syntax_error"},
        {"{\"value\":\"three and a bit\",\"from\":\"km\",\"to\":\"mi\"}", "422", "syntax_error"},
        {"{\"text\":\"1 ton to kg\"}", "422", "ambiguous_unit"},
        {"{\"text\":\"3 cups to ml\",\"value\":3}", "400", "invalid_argument"},
        {"{\"text\":\"3 cups to ml\",\"system\":\"japanese\"}", "400", "invalid_argument"}};
    for (String[] c : cases) {
      given().port(server.port()).contentType("application/json").body(c[0]).post("/v1/tools/units/2/invoke")
          .then().statusCode(Integer.parseInt(c[1])).header(Responses.ERROR_CODE_HEADER, c[2]);
    }
    given().port(server.port()).contentType("application/json").accept("text/plain")
        .body("{\"text\":\"5 km\\u202e to mi\"}").post("/v1/tools/units/2/invoke").then().statusCode(422)
        .body(equalTo("error: syntax_error: the text holds the invisible character U+202E (RIGHT-TO-LEFT OVERRIDE) at"
            + " character 5; remove it; try '5 km to mi'"));
  }
}
