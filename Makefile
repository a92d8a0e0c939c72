# rowgraze - build, tests, sanitizers, fuzzing, benchmarks, demo.
# GPL-3.0-or-later. See DEVELOPERS.md for the layout and conventions.

CC      ?= cc
CSTD     = -std=c11 -D_POSIX_C_SOURCE=200809L
WARN     = -Wall -Wextra -Werror -Wshadow -Wundef -Wwrite-strings \
           -Wmissing-prototypes -Wstrict-prototypes -Wdouble-promotion
OPT     ?= -O2 -g
CFLAGS  ?=
ALLCFLAGS = $(CSTD) $(WARN) $(OPT) $(CFLAGS) -Isrc
LIBS     = -lglpk -lcjson -lcsv -lical -lm
B       ?= build

SRCS     = $(sort $(wildcard src/*.c))
LIBSRCS  = $(filter-out src/main.c,$(SRCS))
LIBOBJS  = $(LIBSRCS:src/%.c=$(B)/obj/%.o)
TESTSRCS = $(sort $(wildcard tests/test_*.c))
TESTS    = $(TESTSRCS:tests/%.c=$(B)/tests/%)
VERSION  = $(shell cat VERSION 2>/dev/null || echo 0.0.0)

.PHONY: all deps demo check check-unit check-cli check-replan check-browser check-sweep check-asan check-valgrind \
        fuzz bench clean distclean

all: $(B)/rowgraze

deps:
	@sh scripts/deps.sh

$(B)/obj/%.o: src/%.c $(wildcard src/*.h) | $(B)/obj
	@echo "  CC    $<"
	@$(CC) $(ALLCFLAGS) -DRG_VERSION='"$(VERSION)"' -DRG_MODELS_DIR='"$(CURDIR)/models"' -c $< -o $@

$(B)/librowgraze.a: $(LIBOBJS)
	@rm -f $@ && ar rcs $@ $^

$(B)/rowgraze: $(B)/obj/main.o $(B)/librowgraze.a
	@echo "  LINK  $@"
	@$(CC) $(ALLCFLAGS) -o $@ $^ $(LIBS)

$(B)/tests/%: tests/%.c tests/rgtest.h $(B)/librowgraze.a | $(B)/tests
	@echo "  LINK  $@"
	@$(CC) $(ALLCFLAGS) -Itests -o $@ $< $(B)/librowgraze.a $(LIBS) -lcmocka

$(B)/obj $(B)/tests:
	mkdir -p $@

# The invented demo farm: check it, then (as later stages land) plan it.
demo: deps
	@$(MAKE) --no-print-directory all
	@sh scripts/demo.sh $(B)/rowgraze

check: deps
	@$(MAKE) --no-print-directory check-unit check-cli check-replan B=$(B)

check-unit: $(TESTS) $(B)/rowgraze
	@sh scripts/run_tests.sh $(TESTS)

check-cli: $(B)/rowgraze
	@sh tests/cli/run.sh $(B)/rowgraze
	@sh tests/report/run.sh $(B)/rowgraze

# The demo report in headless Chromium: no console errors, every figure
# drawn, PDF on A4 and Letter, a screenshot in $(B)/browser/ (skipped with a
# message where Chromium is absent).
check-browser: $(B)/rowgraze
	@sh tests/browser/run.sh $(B)/rowgraze $(B)/browser

# Re-planning from records through the command line, on the demo farm.
check-replan: $(B)/rowgraze
	@sh scripts/check_replan.sh $(B)/rowgraze

# Sun-position sweep against python3-ephem (skipped with a message where absent).
check-sweep: $(B)/sunpos
	@sh tests/sweep/run.sh $(B)/sunpos

$(B)/sunpos: tests/sweep/sunpos.c $(B)/librowgraze.a
	$(CC) $(ALLCFLAGS) -o $@ $< $(B)/librowgraze.a -lm

# Every unit test program and a few commands under valgrind's leak checker.
check-valgrind: $(TESTS) $(B)/rowgraze
	@for t in $(TESTS); do valgrind -q --leak-check=full --error-exitcode=9 $$t >/dev/null 2>&1 \
	  && echo "valgrind clean: $$t" || { echo "valgrind FAILED: $$t"; exit 1; }; done
	@cd tests/cli && valgrind -q --leak-check=full --error-exitcode=9 ../../$(B)/rowgraze strips \
	  data/base.json --hourly --format json >/dev/null && echo "valgrind clean: rowgraze strips"

check-asan: deps
	@$(MAKE) --no-print-directory check-unit check-cli B=build-asan \
	  OPT="-O1 -g -fsanitize=address,undefined -fno-omit-frame-pointer -fno-sanitize-recover=all"

FUZZERS = $(patsubst fuzz/%.c,build-fuzz/%,$(sort $(wildcard fuzz/fuzz_*.c)))
build-fuzz/%: fuzz/%.c $(LIBSRCS) $(wildcard src/*.h)
	mkdir -p build-fuzz
	clang $(CSTD) $(WARN) -O1 -g -fsanitize=fuzzer,address,undefined -Isrc \
	  -o $@ $< $(LIBSRCS) $(LIBS)

fuzz: $(FUZZERS)
	@for f in $(FUZZERS); do n=$${f#build-fuzz/}; \
	  echo "$$f: run with: $$f -max_total_time=60 fuzz/corpus/$${n#fuzz_}"; done

bench: deps
	@$(MAKE) --no-print-directory $(B)/bench_micro $(B)/bench_plan OPT="-O2 -g"
	@sh scripts/bench.sh $(B)

$(B)/bench_plan: bench/bench_plan.c $(B)/librowgraze.a
	@$(CC) $(ALLCFLAGS) -o $@ $< $(B)/librowgraze.a $(LIBS)

$(B)/bench_micro: bench/bench_micro.c $(B)/librowgraze.a
	@$(CC) $(ALLCFLAGS) -o $@ $< $(B)/librowgraze.a $(LIBS)

clean:
	rm -rf build build-asan build-fuzz

distclean: clean
