package reckoner.arith;

import java.math.BigDecimal;
import java.util.ArrayDeque;
import java.util.Deque;
import java.util.HashMap;
import java.util.HashSet;
import java.util.Map;
import java.util.Set;
import net.objecthunter.exp4j.function.Function;
import net.objecthunter.exp4j.operator.Operator;
import net.objecthunter.exp4j.shuntingyard.ShuntingYard;
import net.objecthunter.exp4j.tokenizer.FunctionToken;
import net.objecthunter.exp4j.tokenizer.OperatorToken;
import net.objecthunter.exp4j.tokenizer.Token;
import net.objecthunter.exp4j.tokenizer.VariableToken;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolException;

/**
 * Evaluates an expression: exp4j's tokenizer and shunting-yard turn the scanned text into reverse
 * Polish notation, and this class computes it on decimals. Arithmetic and whole powers are
 * decimal ({@link DecimalMath}); the transcendental functions run in binary64 through
 * {@link StrictMath} (fdlibm), whose results are the same bits on every JVM. Thread-safe.
 */
final class Evaluator {
  /** Functions exp4j does not know by these names. */
  private static final Map<String, Function> EXTRA_FUNCTIONS = Map.of(
      "ln", unary("ln"), "asin", unary("asin"), "acos", unary("acos"), "atan", unary("atan"));

  private static final Set<String> FUNCTIONS = Set.of(
      "sqrt", "cbrt", "abs", "exp", "ln", "log", "log10", "log2",
      "sin", "cos", "tan", "asin", "acos", "atan", "floor", "ceil");

  private Evaluator() {}

  static BigDecimal evaluate(String expr) throws ToolException {
    Scanner.Scanned scanned = Scanner.scan(expr);
    Set<String> names = new HashSet<>();
    for (int i = 0; i < scanned.literals().size(); i++) {
      names.add("_" + i);
    }
    names.add("pi");
    names.add("π");
    names.add("e");
    Token[] rpn;
    try {
      rpn = ShuntingYard.convertToRPN(scanned.rewritten(), new HashMap<>(EXTRA_FUNCTIONS), Map.of(), names, true);
    } catch (IllegalArgumentException e) {
      throw new ToolException(ErrorCode.SYNTAX_ERROR, describe(e));
    }
    Deque<BigDecimal> stack = new ArrayDeque<>();
    for (Token token : rpn) {
      switch (token.getType()) {
        case Token.TOKEN_VARIABLE -> stack.push(value(((VariableToken) token).getName(), scanned));
        case Token.TOKEN_OPERATOR -> {
          Operator op = ((OperatorToken) token).getOperator();
          if (op.getNumOperands() == 1) {
            BigDecimal a = pop(stack, op.getSymbol());
            stack.push(switch (op.getSymbol()) {
              case "-" -> a.negate();
              case "+" -> a;
              default -> throw unknownOperator(op.getSymbol());
            });
          } else {
            BigDecimal b = pop(stack, op.getSymbol());
            BigDecimal a = pop(stack, op.getSymbol());
            stack.push(binary(op.getSymbol(), a, b));
          }
        }
        case Token.TOKEN_FUNCTION -> {
          Function f = ((FunctionToken) token).getFunction();
          String name = f.getName();
          if (!FUNCTIONS.contains(name) || f.getNumArguments() != 1) {
            throw new ToolException(ErrorCode.SYNTAX_ERROR, "unknown function '" + name + "'; known: "
                + String.join(", ", new java.util.TreeSet<>(FUNCTIONS)));
          }
          stack.push(Functions.apply(name, pop(stack, name)));
        }
        default -> throw new ToolException(ErrorCode.SYNTAX_ERROR, "unexpected token in the expression");
      }
    }
    if (stack.size() != 1) {
      throw new ToolException(ErrorCode.SYNTAX_ERROR,
          stack.isEmpty() ? "the expression has no value" : "the expression has operands without an operator between them");
    }
    return stack.pop();
  }

  private static BigDecimal value(String name, Scanner.Scanned scanned) {
    return switch (name) {
      case "pi", "π" -> DecimalMath.PI;
      case "e" -> DecimalMath.E;
      default -> scanned.literals().get(Integer.parseInt(name.substring(1)));
    };
  }

  private static BigDecimal binary(String symbol, BigDecimal a, BigDecimal b) throws ToolException {
    return switch (symbol) {
      case "+" -> DecimalMath.add(a, b);
      case "-" -> DecimalMath.subtract(a, b);
      case "*" -> DecimalMath.multiply(a, b);
      case "/" -> DecimalMath.divide(a, b);
      case "%" -> DecimalMath.remainder(a, b);
      case "^" -> DecimalMath.power(a, b);
      default -> throw unknownOperator(symbol);
    };
  }

  private static BigDecimal pop(Deque<BigDecimal> stack, String what) throws ToolException {
    BigDecimal v = stack.poll();
    if (v == null) {
      throw new ToolException(ErrorCode.SYNTAX_ERROR, "'" + what + "' is missing an operand");
    }
    return v;
  }

  private static ToolException unknownOperator(String symbol) {
    return new ToolException(ErrorCode.SYNTAX_ERROR, "unknown operator '" + symbol + "'");
  }

  /** exp4j's messages name positions in the rewritten text; keep only what helps the caller. */
  private static String describe(IllegalArgumentException e) {
    String m = e.getMessage() == null ? "" : e.getMessage();
    if (e instanceof net.objecthunter.exp4j.tokenizer.UnknownFunctionOrVariableException u) {
      return "unknown name '" + u.getToken() + "'";
    }
    if (m.contains("Mismatched parentheses")) {
      return "mismatched parentheses";
    }
    if (m.contains("operator") || m.contains("Operator")) {
      return "unknown or misplaced operator";
    }
    return "the expression cannot be parsed";
  }

  private static Function unary(String name) {
    return new Function(name, 1) {
      @Override
      public double apply(double... args) {
        throw new UnsupportedOperationException("evaluated by Evaluator, not by exp4j");
      }
    };
  }
}
