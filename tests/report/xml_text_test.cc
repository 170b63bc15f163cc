#include "harness/report/xml_text.h"

#include <doctest/doctest.h>

using treegate::report::xml_safe;

// Allowed characters: W3C, Extensible Markup Language (XML) 1.0 (Fifth Edition), 2008,
// section 2.2 "Characters", production [2] Char.
TEST_CASE("xml_safe: removes what XML 1.0 forbids, keeps the rest") {
  CHECK(xml_safe("a\x01"
                 "b\tc\n") == "ab\tc\n");
  CHECK(xml_safe("<&>\"']]>") == "<&>\"']]>");  // escaping is the writer's job
  CHECK(xml_safe("caf\xc3\xa9") == "caf\xc3\xa9");
  CHECK(xml_safe("\xef\xbf\xbe") == "");  // U+FFFE is not a Char
  CHECK(xml_safe("\xed\xa0\x80") ==
        "\xef\xbf\xbd\xef\xbf\xbd\xef\xbf\xbd");  // a surrogate: not UTF-8
  CHECK(xml_safe("x\xffy") == "x\xef\xbf\xbdy");
  CHECK(xml_safe("\xc0\xaf") == "\xef\xbf\xbd\xef\xbf\xbd");  // overlong '/'
  CHECK(xml_safe("\xf0\x9f\x8c\x8a") == "\xf0\x9f\x8c\x8a");  // U+1F30A
}
