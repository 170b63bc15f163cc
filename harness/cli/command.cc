#include "harness/cli/command.h"

#include <iostream>

namespace treegate::cli {
namespace {

std::vector<Command>& table() {
  static std::vector<Command> t;
  return t;
}

void print_help(const Usage& usage, const po::options_description& opts) {
  std::cout << "treegate " << usage.name << " " << usage.synopsis << "\n\n"
            << usage.purpose << "\n\n"
            << opts << "\nExample:\n  " << usage.example << "\n\nExit codes: " << usage.exit_codes
            << "\n";
}

}  // namespace

const std::vector<Command>& commands() { return table(); }

Registration::Registration(Command command) { table().push_back(command); }

int fail(const std::string& command, const std::string& message) {
  std::cerr << "treegate " << command << ": " << message << "\n";
  return kExitBadInput;
}

int parse_command_line(int argc, char** argv, const Usage& usage,
                       const po::options_description& opts,
                       const po::positional_options_description& positional,
                       po::variables_map& vm) {
  po::options_description all(opts);
  all.add_options()("help,h", "show this help");
  try {
    po::store(po::command_line_parser(argc, argv).options(all).positional(positional).run(), vm);
    if (vm.count("help")) {
      print_help(usage, all);
      return kExitOk;
    }
    po::notify(vm);
  } catch (const po::error& e) {
    std::cerr << "treegate " << usage.name << ": " << e.what() << "\n"
              << "usage: treegate " << usage.name << " " << usage.synopsis << "  (see 'treegate "
              << usage.name << " --help')\n";
    return kExitBadInput;
  }
  return -1;
}

}  // namespace treegate::cli
