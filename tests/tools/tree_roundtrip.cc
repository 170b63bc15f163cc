// Test tool: reads bracketed trees from a file and writes each back in the one-line form, so
// scripts can compare treegate's reading of a file with another library's.
#include <fstream>
#include <iostream>

#include "evaluator/bracket_io.h"
#include "evaluator/errors.h"

int main(int argc, char** argv) {
  if (argc != 2) {
    std::cerr << "usage: tree_roundtrip FILE\n";
    return 2;
  }
  std::ifstream in(argv[1], std::ios::binary);
  treegate::BracketReader reader(in, argv[1]);
  treegate::Tree tree;
  try {
    while (reader.next(tree)) std::cout << treegate::to_bracketed(tree) << "\n";
  } catch (const treegate::InputError& e) {
    std::cerr << e.what() << "\n";
    return 2;
  }
  return 0;
}
