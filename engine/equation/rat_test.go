package equation_test

import (
	"math"
	"strings"
	"testing"

	"gibbsheet/engine/equation"
)

func TestParseRat(t *testing.T) {
	tests := []struct {
		in       string
		num, den int64
		str      string
	}{
		{"2", 2, 1, "2"},
		{"-3", -3, 1, "-3"},
		{"+4", 4, 1, "4"},
		{"0", 0, 1, "0"},
		{"0.5", 1, 2, "0.5"},
		{"0.1", 1, 10, "0.1"},
		{"0.25", 1, 4, "0.25"},
		{"2.50", 5, 2, "2.5"},
		{"-0.125", -1, 8, "-0.125"},
		{"1/2", 1, 2, "0.5"},
		{"2/6", 1, 3, "1/3"},
		{"-2/6", -1, 3, "-1/3"},
		{"10/4", 5, 2, "2.5"},
		{"7/1", 7, 1, "7"},
		{"1/64", 1, 64, "0.015625"},
		{"0042", 42, 1, "42"},
		{"123456789012345678", 123456789012345678, 1, "123456789012345678"},
		{"0.000000000000000001", 1, 1000000000000000000, "0.000000000000000001"},
		{"1/576460752303423488", 1, 576460752303423488, "1/576460752303423488"}, // 2^-59: decimal too long
	}
	for _, tt := range tests {
		r, err := equation.ParseRat(tt.in)
		if err != nil {
			t.Errorf("ParseRat(%q): %v", tt.in, err)
			continue
		}
		if r.Num != tt.num || r.Den != tt.den {
			t.Errorf("ParseRat(%q) = %d/%d, want %d/%d", tt.in, r.Num, r.Den, tt.num, tt.den)
		}
		if got := r.String(); got != tt.str {
			t.Errorf("ParseRat(%q).String() = %q, want %q", tt.in, got, tt.str)
		}
		if back, err := equation.ParseRat(r.String()); err != nil || back != r {
			t.Errorf("ParseRat(%q) = %v, %v; want %v", r.String(), back, err, r)
		}
	}
}

func TestParseRatErrors(t *testing.T) {
	tests := []struct{ in, msg string }{
		{"", "no digits"},
		{"-", "no digits"},
		{"1..2", "more than one decimal point"},
		{"1.2.3", "more than one decimal point"},
		{"1/2/3", `more than one "/"`},
		{"1/0", "denominator is zero"},
		{"0.5/2", "whole numbers"},
		{"/2", "both sides"},
		{"2/", "both sides"},
		{".5", "decimal point"},
		{"5.", "decimal point"},
		{"1e3", `unexpected character 'e'`},
		{"2,5", `unexpected character ','`},
		{"½", `unexpected character '½'`},
		{"--2", `unexpected character '-'`},
		{"1234567890123456789", "too many digits"},
		{"1.234567890123456789", "too many digits"},
		{"1/1234567890123456789", "too many digits"},
		{strings.Repeat("9", 1000), "too many digits"},
	}
	for _, tt := range tests {
		r, err := equation.ParseRat(tt.in)
		if err == nil {
			t.Errorf("ParseRat(%q) = %v, want error", tt.in, r)
			continue
		}
		if !strings.Contains(err.Error(), tt.msg) {
			t.Errorf("ParseRat(%q) error %q, want it to contain %q", tt.in, err, tt.msg)
		}
	}
}

func TestRatArithmetic(t *testing.T) {
	half, third := equation.Rat{Num: 1, Den: 2}, equation.Rat{Num: 1, Den: 3}
	if got, ok := half.Add(third); !ok || got != (equation.Rat{Num: 5, Den: 6}) {
		t.Errorf("1/2 + 1/3 = %v, %v; want 5/6", got, ok)
	}
	if got, ok := half.Add(half.Neg()); !ok || !got.IsZero() || got.Sign() != 0 || got.Den != 1 {
		t.Errorf("1/2 - 1/2 = %#v, %v; want 0/1", got, ok)
	}
	if got, ok := half.Mul(equation.Rat{Num: -4, Den: 6}); !ok || got != (equation.Rat{Num: -1, Den: 3}) {
		t.Errorf("1/2 · -4/6 = %v, %v; want -1/3", got, ok)
	}
	big := equation.Rat{Num: math.MaxInt64, Den: 1}
	if got, ok := big.Add(equation.Rat{Num: 1, Den: 1}); ok {
		t.Errorf("MaxInt64 + 1 = %v, want overflow", got)
	}
	if got, ok := big.Mul(equation.Rat{Num: 2, Den: 1}); ok {
		t.Errorf("MaxInt64 · 2 = %v, want overflow", got)
	}
	// A result that fits although the naive cross products overflow.
	a := equation.Rat{Num: math.MaxInt64, Den: 2}
	if got, ok := a.Mul(equation.Rat{Num: 2, Den: math.MaxInt64}); !ok || got != (equation.Rat{Num: 1, Den: 1}) {
		t.Errorf("(MaxInt64/2)·(2/MaxInt64) = %v, %v; want 1", got, ok)
	}
	if got := (equation.Rat{Num: -3, Den: -6}); got.Sign() != 1 || got.String() != "0.5" || got.Neg().String() != "-0.5" {
		t.Errorf("Rat{-3,-6}: Sign %d, String %q, Neg %q", got.Sign(), got.String(), got.Neg().String())
	}
	if got := (equation.Rat{}); !got.IsZero() || got.String() != "0" || got.Float() != 0 {
		t.Errorf("Rat{} = %q, %v", got.String(), got.Float())
	}
	if got := (equation.Rat{Num: 3}); got.String() != "3" || got.Float() != 3 {
		t.Errorf("Rat{Num: 3} = %q, %v; want 3", got.String(), got.Float())
	}
	if got := third.Float(); got != 1.0/3 {
		t.Errorf("(1/3).Float() = %v", got)
	}
	if got := (equation.Rat{Num: math.MaxInt64, Den: math.MaxInt64 - 1}).Float(); got != 1 {
		t.Errorf("Float of a ratio near 1 = %v, want 1", got)
	}
	if _, ok := equation.NewRat(1, 0); ok {
		t.Error("NewRat(1, 0) succeeded")
	}
	if r, ok := equation.NewRat(6, -4); !ok || r != (equation.Rat{Num: -3, Den: 2}) {
		t.Errorf("NewRat(6, -4) = %v, %v", r, ok)
	}
	if _, ok := equation.NewRat(math.MinInt64, 1); ok {
		t.Error("NewRat(MinInt64, 1) succeeded; its negation does not fit")
	}
}

func TestRatFromFloat(t *testing.T) {
	tests := []struct {
		f        float64
		num, den int64
		ok       bool
	}{
		{0.1, 1, 10, true},
		{0.5, 1, 2, true},
		{-2, -2, 1, true},
		{2.5e-7, 1, 4000000, true},
		{0.30000000000000004, 7500000000000001, 25000000000000000, true},
		{1e30, 0, 0, false},
		{1e-30, 0, 0, false},
		{math.NaN(), 0, 0, false},
		{math.Inf(-1), 0, 0, false},
	}
	for _, tt := range tests {
		r, ok := equation.RatFromFloat(tt.f)
		if ok != tt.ok || ok && (r.Num != tt.num || r.Den != tt.den) {
			t.Errorf("RatFromFloat(%v) = %d/%d, %v; want %d/%d, %v", tt.f, r.Num, r.Den, ok, tt.num, tt.den, tt.ok)
		}
	}
}
