// The table of subcommands. Each subcommand lives in its own file in this folder and adds
// itself with a static Registration; main.cc only dispatches. Subcommands parse options and
// call the libraries; they hold no logic of their own.
#pragma once

#include <string>
#include <vector>

#include <boost/program_options.hpp>

namespace treegate::cli {

struct Command {
  const char* name;
  const char* purpose;                // one line, shown in `treegate --help`
  int (*run)(int argc, char** argv);  // argv[0] is the subcommand's name
};

const std::vector<Command>& commands();

struct Registration {
  explicit Registration(Command command);
};

/// Exit codes shared by every subcommand.
inline constexpr int kExitOk = 0;
inline constexpr int kExitGateFailed = 1;
inline constexpr int kExitBadInput = 2;

namespace po = boost::program_options;

/// What a subcommand tells the option parser and the help text.
struct Usage {
  std::string name;      // "score"
  std::string synopsis;  // "GOLD TEST [options]"
  std::string purpose;   // one line
  std::string example;   // a runnable example using the demo files
  std::string exit_codes = "0 done, 2 bad usage or unreadable input";
};

/// Parses argv into `vm`. Returns -1 to go on, or an exit code (after --help, or after a
/// usage error, which is printed to stderr with the help hint).
int parse_command_line(int argc, char** argv, const Usage& usage,
                       const po::options_description& opts,
                       const po::positional_options_description& positional, po::variables_map& vm);

/// Prints "treegate CMD: message" to stderr and returns kExitBadInput.
int fail(const std::string& command, const std::string& message);

}  // namespace treegate::cli
