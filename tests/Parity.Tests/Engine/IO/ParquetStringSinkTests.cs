using System.Text;
using Parity.Engine.Errors;
using Parity.Engine.IO;
using Parity.Engine.Modes;
using Parquet;
using Parquet.Schema;

namespace Parity.Tests.Engine.IO;

/// <summary>
/// The Parquet string path copies raw UTF-8 slices into one buffer and checks UTF-8 once over the whole
/// buffer. These files are written by Parquet.Net (the reference library for the Parquet format here) with
/// raw byte arrays, so invalid and split values can be stored.
/// </summary>
public sealed class ParquetStringSinkTests : IDisposable
{
    private readonly TestFiles _files = new();

    public void Dispose() => _files.Dispose();

    private async Task<string> WriteAsync(params byte[]?[][] groups)
    {
        var path = _files.PathOf("s.parquet");
        var field = new DataField<byte[]>("s", true);
        await using var fs = File.Create(path);
        await using var w = await ParquetWriter.CreateAsync(new ParquetSchema(field), fs);
        foreach (var g in groups)
        {
            using var rg = w.CreateRowGroup();
            await rg.WriteAsync(field, g);
        }
        return path;
    }

    private static byte[] U(string s) => Encoding.UTF8.GetBytes(s);

    // Several row groups, the later ones denser than the first (the buffer must grow), with nulls,
    // empty values and non-ASCII text (Unicode Standard §3.9: UTF-8 of Greek, CJK and an emoji).
    [Fact]
    public async Task Row_groups_of_different_density_round_trip()
    {
        var first = new byte[]?[] { U("a"), null, U(""), U("b") };
        var second = new byte[]?[] { U(new string('x', 300)), U("Σοφία"), null, U("山田 花子 🚢") };
        var third = new byte[]?[] { U(""), U(new string('é', 500)) };
        var path = await WriteAsync(first, second, third);
        var expected = first.Concat(second).Concat(third).ToArray();
        foreach (var mode in new[] { Mode.Modern, Mode.Legacy })
        {
            DataLoader.ClearCache();
            var c = DataLoader.Load(path, LoadOptions.Default, mode)["s"];
            Assert.Equal(expected.Length, c.Length);
            for (var i = 0; i < expected.Length; i++)
            {
                if (expected[i] is null) Assert.True(c.IsMissing(i));
                else Assert.Equal(Encoding.UTF8.GetString(expected[i]!), c.GetValue(i).String);
            }
        }
    }

    // Unicode Standard §3.9 (D92): "a" + 0xC3 and 0xA9 + "b" are each ill-formed, though their concatenation
    // "aéb" is well-formed; the whole-buffer check must still reject the file at the first bad row.
    [Fact]
    public async Task A_code_point_split_across_values_is_located()
    {
        var path = await WriteAsync(new byte[]?[] { U("ok"), [0x61, 0xC3], [0xA9, 0x62], U("fine") });
        DataLoader.ClearCache();
        var ex = Assert.Throws<EngineException>(() => DataLoader.Load(path, LoadOptions.Default, Mode.Modern));
        Assert.Equal(ErrorCodes.Utf8, ex.Code);
        Assert.Equal(2, ex.Row); // 1-based: "a" 0xC3 is the first ill-formed value (a truncated sequence)
    }

    // Unicode Standard §3.9: 0xFF never occurs in UTF-8; found in the third row of the second row group.
    [Fact]
    public async Task An_invalid_byte_is_located_across_row_groups()
    {
        var path = await WriteAsync(new byte[]?[] { U("a"), U("b") }, new byte[]?[] { U("c"), [0x41, 0xFF], U("d") });
        DataLoader.ClearCache();
        var ex = Assert.Throws<EngineException>(() => DataLoader.Load(path, LoadOptions.Default, Mode.Modern));
        Assert.Equal(ErrorCodes.Utf8, ex.Code);
        Assert.Equal(4, ex.Row);
    }
}
