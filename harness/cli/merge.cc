// treegate merge: combine the results files of the shards of one run.
#include <iostream>

#include "evaluator/errors.h"
#include "harness/cli/command.h"
#include "harness/results/merge.h"

namespace treegate::cli {
namespace {

int run_merge(int argc, char** argv) {
  const Usage usage{
      "merge", "RESULTS... -o RESULTS",
      "Combine the results files of the shards of one run (`run --shard K/N`) into one.",
      "treegate merge shard-1.jsonl shard-2.jsonl -o results.jsonl",
      "0 merged, 2 bad usage, unreadable input or shards that do not fit together"};
  std::vector<std::string> inputs;
  std::string output;
  po::options_description opts("options");
  opts.add_options()("inputs", po::value(&inputs)->required()->multitoken(),
                     "results files of the shards")("output,o", po::value(&output)->required(),
                                                    "the merged results file");
  po::positional_options_description pos;
  pos.add("inputs", -1);
  po::variables_map vm;
  if (int code = parse_command_line(argc, argv, usage, opts, pos, vm); code >= 0) return code;
  try {
    std::vector<results::RunResults> parts;
    for (const auto& f : inputs) parts.push_back(results::load_results(f));
    const results::RunResults merged = results::merge_results(parts, inputs);
    results::write_results(output, merged);
    std::cout << "merged " << parts.size() << " shards, " << merged.cases.size() << " cases into "
              << output << "\n";
    return kExitOk;
  } catch (const InputError& e) {
    return fail("merge", e.what());
  }
}

const Registration reg({"merge", "combine the results files of the shards of one run", &run_merge});

}  // namespace
}  // namespace treegate::cli
