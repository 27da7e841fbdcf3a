package org.quantrun.runner;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import picocli.CommandLine;

class MainTest {

  @Test
  @DisplayName("every sub-command is registered under the name its own @Command annotation gives")
  void namesMatchTheAnnotations() {
    for (Map.Entry<String, Class<?>> e : Main.COMMANDS.entrySet()) {
      CommandLine.Command c = e.getValue().getAnnotation(CommandLine.Command.class);
      assertEquals(e.getKey(), c.name(), e.getValue().getName());
    }
  }

  @Test
  @DisplayName("a run naming a sub-command builds only that one; help, --version and unknown names build them all")
  void buildsOnlyWhatTheRunNeeds() {
    assertEquals(List.of("process"), List.copyOf(Main.forArguments(new String[] {"process", "x.csv"}).getSubcommands().keySet()));
    assertEquals(List.of("watch"), List.copyOf(Main.forArguments(new String[] {"watch", "--help"}).getSubcommands().keySet()));
    List<String> all = List.copyOf(Main.COMMANDS.keySet());
    for (String[] args : List.of(new String[0], new String[] {"--version"}, new String[] {"help", "process"},
        new String[] {"proces", "x.csv"})) {
      assertEquals(all, List.copyOf(Main.forArguments(args).getSubcommands().keySet()), String.join(" ", args));
    }
  }

  @Test
  @DisplayName("the help lists every sub-command, as before they were registered in code")
  void helpListsEveryCommand() {
    String help = Main.commandLine().getUsageMessage();
    for (String name : Main.COMMANDS.keySet()) {
      assertEquals(true, help.contains("  " + name + " ") || help.contains("  " + name + "\n"), name + " in:\n" + help);
    }
  }
}
