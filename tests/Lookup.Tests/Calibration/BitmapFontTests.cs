using Lookup.Calibration;

namespace Lookup.Tests.Calibration;

public sealed class BitmapFontTests
{
    [Fact]
    public void Every_glyph_is_5_by_7_cells_and_no_two_glyphs_are_alike()
    {
        var glyphs = BitmapFont.Characters.Select(BitmapFont.Glyph).ToList();

        Assert.All(glyphs, g => Assert.Matches("^[.#]{35}$", g));
        Assert.Equal(glyphs.Count, glyphs.Distinct(StringComparer.Ordinal).Count());
    }

    [Fact]
    public void Capitals_digits_and_the_plot_punctuation_all_have_glyphs()
    {
        var have = BitmapFont.Characters.ToHashSet();

        Assert.All("ABCDEFGHIJKLMNOPQRSTUVWXYZ0123456789.,-+%:()/<>= ", c => Assert.Contains(c, have));
    }

    [Fact]
    public void Lower_case_is_drawn_in_capitals_and_unknown_characters_as_a_question_mark()
    {
        Assert.Equal(BitmapFont.Glyph('A'), BitmapFont.Glyph('a'));
        Assert.Equal(BitmapFont.Glyph('?'), BitmapFont.Glyph('€'));
        Assert.True(BitmapFont.Ink('I', 2, 3));
        Assert.False(BitmapFont.Ink(' ', 2, 3));
    }
}
