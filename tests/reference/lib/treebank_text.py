"""Splitting treebank files into their top-level bracketed trees, for the reference checks
(tests/reference/*.py) and the benchmarks that read the open treebank (bench/*). One copy of
the bracket-depth scan; nltk is imported only by read_nltk_trees."""


def split_bracketed(text):
    """The top-level bracketed trees of `text`, as substrings, in file order."""
    trees, depth, start = [], 0, 0
    for i, c in enumerate(text):
        if c == "(":
            if depth == 0:
                start = i
            depth += 1
        elif c == ")":
            depth -= 1
            if depth == 0:
                trees.append(text[start:i + 1])
    return trees


def read_nltk_trees(paths):
    """Every tree of the files `paths` as an nltk.Tree, file after file."""
    from nltk import Tree
    trees = []
    for path in paths:
        with open(path, encoding="utf-8") as f:
            trees += [Tree.fromstring(s) for s in split_bracketed(f.read())]
    return trees
