using System.Globalization;
using System.Text;

namespace Parity.Benchmarks.Data;

/// <summary>
/// <c>wide ROWS OUT.csv [SEED]</c>: the 20-column Harbor Line table of the large-input measurements
/// (docs/reliability.md "Large inputs"). Seeded, so the same arguments give the same bytes on every machine:
/// ids, integers with missing values, floats, booleans, ISO 8601 time stamps (UTC and with offsets), passenger
/// names in several scripts (Latin with accents, Greek, CJK, emoji), notes that are mostly missing, vessels,
/// piers and codes. About 110 bytes a row.
/// </summary>
internal static class WideGenerator
{
    private const int DefaultSeed = 20_260_814;

    private static readonly string[] Given =
    [
        "Mira", "José", "Zoë", "Łukasz", "Ingrid", "Aoife", "Noé", "Søren", "Çağla", "Tomás",
        "Νίκος", "Ελένη", "Δήμητρα", "さくら", "花子", "太郎", "민준", "서연", "Amara", "Kofi",
        "Hanna 🌊", "Ilse", "Đorđe", "Ana-María", "Björn", "Yusuf", "Leilani", "Oğuz", "Renée", "Wiremu",
    ];

    private static readonly string[] Family =
    [
        "Okafor", "山田", "Ångström", "Papadopoulou", "Nuñez", "Kowalczyk", "O'Brien", "Müller", "Østergaard",
        "Καραγιάννης", "佐藤", "김", "Dubois", "Hernández", "Lindqvist", "Nakamura", "Ferreira ⛴", "Tanaka",
        "Żółkiewski", "Ó Súilleabháin", "Haddad", "Van der Berg", "Rossi", "Ivanović", "Mendes",
    ];

    private static readonly string[] Notes =
    [
        "late boarding", "wheelchair", "bike on deck", "refund asked", "lost ticket", "dog 🐕", "groupe scolaire",
        "ταξίδι επιστροφής", "荷物あり", "needs \"quiet\" seat", "pram, two bags",
    ];

    private static readonly string[] Vessels =
    [
        "Harbor Swift", "Morning Gull", "Ferryhaven", "Stella Maris", "Kestrel", "Øresund Light", "Pelican II", "Tern",
    ];

    private static readonly string[] Channels = ["app", "kiosk", "web", "on board", "agent"];

    private static readonly string[] Classes = ["standard", "flex", "first", "crew"];

    private static readonly string[] Offsets = ["Z", "+02:00", "+01:00", "-03:30", "+05:45", "Z"];

    public static int Run(string rowsText, string path, string? seedText)
    {
        var rows = long.Parse(rowsText, CultureInfo.InvariantCulture);
        var seed = seedText is null ? DefaultSeed : int.Parse(seedText, CultureInfo.InvariantCulture);
        var rng = new Random(seed);
        var inv = CultureInfo.InvariantCulture;
        using var writer = new StreamWriter(path, false, new UTF8Encoding(false), 1 << 20) { NewLine = "\n" };
        writer.WriteLine("ticket_id,sailing_id,passenger,age,fare,tip,is_child,checked_in,paid_at,boarded_at,"
            + "note,vessel,pier,route_code,seat,fare_class,channel,bags,crossing_min,weight_kg");
        var start = new DateTime(2026, 1, 1, 0, 0, 0, DateTimeKind.Utc);
        Span<char> buf = stackalloc char[64];
        for (long i = 1; i <= rows; i++)
        {
            var age = rng.Next(0, 95);
            var paid = start.AddSeconds(rng.Next(0, 365 * 24 * 3600));
            var crossing = rng.Next(12, 75);
            writer.Write(i.ToString(inv));
            writer.Write(',');
            writer.Write((1000 + rng.Next(0, 2000)).ToString(inv));
            writer.Write(',');
            Quote(writer, Given[rng.Next(Given.Length)] + " " + Family[rng.Next(Family.Length)]);
            writer.Write(',');
            if (rng.Next(20) != 0) writer.Write(age.ToString(inv)); // about 5% missing
            writer.Write(',');
            writer.Write((rng.Next(150, 4800) / 100.0).ToString("0.00", inv));
            writer.Write(',');
            if (rng.Next(4) == 0) writer.Write((rng.Next(0, 500) / 100.0).ToString("0.00", inv)); // mostly missing
            writer.Write(',');
            writer.Write(age < 16 ? "true" : "false");
            writer.Write(',');
            writer.Write(rng.Next(10) == 0 ? "false" : "true");
            writer.Write(',');
            writer.Write(Stamp(paid, Offsets[rng.Next(Offsets.Length)], buf));
            writer.Write(',');
            writer.Write(Stamp(paid.AddMinutes(rng.Next(5, 600)), "Z", buf));
            writer.Write(',');
            if (rng.Next(10) == 0) Quote(writer, Notes[rng.Next(Notes.Length)]); // about 90% missing
            writer.Write(',');
            Quote(writer, Vessels[rng.Next(Vessels.Length)]);
            writer.Write(',');
            writer.Write("P" + rng.Next(1, 13).ToString(inv));
            writer.Write(',');
            writer.Write("HL-" + rng.Next(1, 40).ToString("00", inv));
            writer.Write(',');
            writer.Write(rng.Next(1, 60).ToString(inv) + (char)('A' + rng.Next(6)));
            writer.Write(',');
            writer.Write(Classes[rng.Next(Classes.Length)]);
            writer.Write(',');
            writer.Write(Channels[rng.Next(Channels.Length)]);
            writer.Write(',');
            if (rng.Next(50) != 0) writer.Write(rng.Next(0, 4).ToString(inv));
            writer.Write(',');
            writer.Write(crossing.ToString(inv));
            writer.Write(',');
            writer.Write((rng.Next(20_000, 120_000) / 1000.0).ToString("0.###", inv));
            writer.WriteLine();
        }
        return 0;
    }

    private static string Stamp(DateTime utc, string offset, Span<char> buf)
    {
        var local = offset switch
        {
            "Z" => utc,
            "+02:00" => utc.AddHours(2),
            "+01:00" => utc.AddHours(1),
            "-03:30" => utc.AddMinutes(-210),
            _ => utc.AddMinutes(345),
        };
        local.TryFormat(buf, out var n, "yyyy-MM-dd'T'HH:mm:ss", CultureInfo.InvariantCulture);
        return string.Concat(buf[..n], offset);
    }

    /// <summary>RFC 4180 quoting where a field needs it (comma, quote, line break).</summary>
    private static void Quote(StreamWriter writer, string s)
    {
        if (s.AsSpan().IndexOfAny(",\"\n\r") < 0)
        {
            writer.Write(s);
            return;
        }
        writer.Write('"');
        writer.Write(s.Replace("\"", "\"\"", StringComparison.Ordinal));
        writer.Write('"');
    }
}
