import com.sun.tools.attach.VirtualMachine;

/** Loads a native agent into a running JVM with its options passed whole: Attach PID LIBRARY OPTIONS. */
public final class Attach {
  public static void main(String[] args) throws Exception {
    VirtualMachine vm = VirtualMachine.attach(args[0]);
    try {
      vm.loadAgentPath(args[1], args[2]);
    } finally {
      vm.detach();
    }
  }
}
