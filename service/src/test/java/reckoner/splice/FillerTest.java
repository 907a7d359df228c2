package reckoner.splice;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.quicktheories.QuickTheory.qt;

import java.time.Clock;
import java.util.ArrayList;
import java.util.List;
import java.util.OptionalInt;
import org.junit.jupiter.api.Test;
import org.quicktheories.core.Gen;
import org.quicktheories.impl.Constraint;
import reckoner.Tools;
import reckoner.call.Invoker;
import reckoner.spec.Json;
import reckoner.spec.SpecLoader;
import reckoner.spec.ToolCatalog;
import reckoner.tool.ToolRegistry;

final class FillerTest {
  private static final Invoker INVOKER = new Invoker(ToolCatalog.of(ToolRegistry.of(Tools.demo()), new SpecLoader(Json.newMapper())),
      Clock.systemUTC());
  private final Filler filler = new Filler(INVOKER);

  @Test
  void fill_answersEveryCall_andReportsPositions() {
    Filler.Filled f = filler.fill("A <<arith(1250/4000)>>, B <<arith(1/0)>>.", Markup.DEFAULT, OnError.SPLICE_ERROR, Filler.Tags.NONE);
    assertEquals("A <<arith(1250/4000) => 0.31>>, B <<arith(1/0) => error: domain_error: division by zero>>.", f.document());
    assertEquals(List.of(2, 26), f.calls().stream().map(Filler.Spliced::position).toList());
  }

  @Test
  void fill_onErrorDropOrKeep() {
    String doc = "x <<arith(1/0)>> y <<arith(2)>>";
    assertEquals("x  y <<arith(2) => 2>>", filler.fill(doc, Markup.DEFAULT, OnError.DROP, Filler.Tags.NONE).document());
    assertEquals("x <<arith(1/0)>> y <<arith(2) => 2>>", filler.fill(doc, Markup.DEFAULT, OnError.KEEP, Filler.Tags.NONE).document());
  }

  @Test
  void fill_answeredCallsAndMalformedMarkup_stayAsWritten() {
    String doc = "<<arith(1) => 7>> <<arith(1+1 <<arith(3)>>";
    Filler.Filled f = filler.fill(doc, Markup.DEFAULT, OnError.SPLICE_ERROR, Filler.Tags.NONE);
    assertEquals(doc, f.document());
    assertEquals(1, f.malformed().size());
    assertEquals(0, f.calls().size());
  }

  @Test
  void splice_answerHoldingTheSeparator_isRefused_notPassedThrough() {
    // With "3" as separator, the answer "0.31" cannot be spliced unambiguously.
    Markup m = new Markup("<<", "3", ">>");
    Filler.Filled f = filler.fill("<<arith(1250/4000)>>", m, OnError.SPLICE_ERROR, Filler.Tags.NONE);
    assertEquals("unspliceable", f.calls().get(0).outcome().error().get().code().wireName());
    assertFalse(f.document().contains("0.31"));
  }

  /** Documents of random prose with calls in random places; fills parse back to the same calls and single-invoke answers. */
  @Test
  void fill_roundTrip_onGeneratedDocuments() {
    String[] words = {"the", "ledger", "of", "Vell", "harbour", "shows", "(", ")", "=", "<", ">", "%", "\n", "é", "😀", "—"};
    String[] exprs = {"1250/4000", "2^3^2", "1/0", "sqrt(2)", "17 % 5", "-(3)", "x+1", "(1+2)*3", "1e3/7", "pi"};
    Gen<String> documents = in -> {
      StringBuilder sb = new StringBuilder();
      int n = (int) in.next(Constraint.between(0, 30));
      for (int i = 0; i < n; i++) {
        if (in.next(Constraint.between(0, 3)) == 0) {
          sb.append("<<arith(").append(exprs[(int) in.next(Constraint.between(0, exprs.length - 1))]).append(")>>");
        } else {
          sb.append(words[(int) in.next(Constraint.between(0, words.length - 1))]).append(' ');
        }
      }
      return sb.toString();
    };
    qt().withExamples(2_000).withFixedSeed(42L).forAll(documents).checkAssert(doc -> {
      Filler.Filled f = filler.fill(doc, Markup.DEFAULT, OnError.SPLICE_ERROR, Filler.Tags.NONE);
      List<Document.Part> back = Document.parse(f.document(), Markup.DEFAULT).parts();
      List<String> answers = new ArrayList<>();
      for (Document.Part p : back) {
        if (p.call().isPresent()) {
          assertTrue(p.answer().isPresent(), "every call answered: " + f.document());
          String single = INVOKER.invokeText(p.call().get().tool(), OptionalInt.empty(), p.call().get().input(), null, null, null).text();
          assertEquals(single, p.answer().get());
          answers.add(p.answer().get());
        }
      }
      assertEquals(f.calls().stream().map(c -> c.outcome().text()).toList(), answers);
      assertEquals(doc.split("<<", -1).length, f.document().split("<<", -1).length, "no call lost or added");
    });
  }
}
