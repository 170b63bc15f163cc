// treegate: dispatches to the subcommand named by the first argument.
#include <algorithm>
#include <cstring>
#include <iostream>

#include "harness/cli/command.h"
#include "treegate_version.h"

namespace {

void print_overview() {
  std::cout << "treegate " TREEGATE_VERSION
               " - regression tests for probabilistic context-free grammars\n\n"
               "usage: treegate COMMAND [options]   (treegate COMMAND --help for details)\n\n"
               "commands:\n";
  auto list = treegate::cli::commands();
  std::sort(list.begin(), list.end(),
            [](const auto& a, const auto& b) { return std::strcmp(a.name, b.name) < 0; });
  for (const auto& c : list) {
    std::cout << "  " << c.name
              << std::string(10 - std::min<std::size_t>(9, std::strlen(c.name)), ' ') << c.purpose
              << "\n";
  }
  std::cout << "\nExit codes: 0 pass, 1 gate failed, 2 bad usage or bad input.\n";
}

}  // namespace

int main(int argc, char** argv) {
  if (argc < 2 || !std::strcmp(argv[1], "--help") || !std::strcmp(argv[1], "-h") ||
      !std::strcmp(argv[1], "help")) {
    print_overview();
    return argc < 2 ? treegate::cli::kExitBadInput : treegate::cli::kExitOk;
  }
  if (!std::strcmp(argv[1], "--version")) {
    std::cout << "treegate " TREEGATE_VERSION "\n";
    return 0;
  }
  for (const auto& c : treegate::cli::commands()) {
    if (!std::strcmp(c.name, argv[1])) {
      try {
        return c.run(argc - 1, argv + 1);
      } catch (const std::exception& e) {
        std::cerr << "treegate " << c.name << ": " << e.what() << "\n";
        return treegate::cli::kExitBadInput;
      }
    }
  }
  std::cerr << "treegate: unknown command '" << argv[1] << "' (see 'treegate --help')\n";
  return treegate::cli::kExitBadInput;
}
