using Parity.Harness.Storage;
using System.Globalization;
using System.Text;
using Parity.Engine.Columns;
using Parity.Engine.Frames;
using Parity.Engine.IO;
using Parity.Engine.Modes;
using Parquet;
using Parquet.Schema;

namespace Parity.Harness.Fixtures;

/// <summary>
/// Invented demo data for the Harbor Line lake-ferry co-operative (spec §7), from a seed, so the same
/// seed and row count always give the same bytes:
/// <list type="bullet">
/// <item><c>tickets.csv</c>: ticket_id, sailing_id, passenger (Latin with accents, Greek, CJK, emoji),
/// age (some missing), fare (refunds negative), paid_at (ISO 8601 with offsets), note (mostly missing; some
/// with commas, quotes and line breaks), is_child (bool; missing where the age is).</item>
/// <item><c>sailings.parquet</c>: sailing_id, route_id, departs_at (timestamp), vessel (some null),
/// capacity (int32, widened on load), cancelled (bool, some null).</item>
/// <item><c>routes.arrow</c>: route_id, name, from_pier, to_pier, km.</item>
/// </list>
/// </summary>
public sealed class HarborLineGenerator
{
    private static readonly string[] FirstNames =
    [
        "Zoë", "Émile", "Björn", "Łucja", "Ngozi", "Íñigo", "Søren", "Marta", "Joaquín", "Ana",
        "Αλέξανδρος", "Ελένη", "Νίκος", "Σοφία", "花子", "明", "さくら", "민준", "서연", "Đức",
        "Ørjan", "Chloé", "Tomás", "Greta", "Kai 🦆", "Mira 🌊", "Jonas", "Ayşe", "Čeněk", "Lea",
    ];

    private static readonly string[] LastNames =
    [
        "Lindqvist", "Rousseau", "Ågren", "Wiśniewska", "Okafor", "Müller", "Nørgaard", "García",
        "Παππάς", "Δημητρίου", "Οικονόμου", "山田", "李", "佐藤", "김", "박", "Nguyễn", "Kovač",
        "Brontë", "Żółw", "Dvořák", "Ferris ⛴️", "O'Shea", "Van der Berg", "Šimůnek", "Yılmaz",
    ];

    private static readonly string[] Notes =
    [
        "wheelchair space", "bike on board", "group, 4 people", "refund: \"weather\"", "dog (small)",
        "paid twice\nrefunded once", "late booking", "Ελληνική ομάδα", "学生割引", "🎂 birthday trip",
    ];

    private static readonly (string Name, string From, string To, double Km)[] Routes =
    [
        ("North Loop", "Old Harbor", "Birch Point", 7.5),
        ("Island Hop", "Old Harbor", "Gull Island", 4.2),
        ("Bay Express", "Market Pier", "Eastbay", 11.8),
        ("Sunset Cruise", "Market Pier", "Market Pier", 9.0),
        ("Cross Lake", "Westshore", "Eastbay", 13.4),
        ("Reed Channel", "Birch Point", "Reedmoor", 3.1),
    ];

    private static readonly string[] Vessels = ["Heron", "Kittiwake", "Lumi", "Åsa", "Old Pike", "Μέλισσα"];

    private readonly int _seed;

    public HarborLineGenerator(int seed)
    {
        _seed = seed;
    }

    /// <summary>Writes the three files into <paramref name="directory"/>; returns their paths.</summary>
    public IReadOnlyList<string> Write(string directory, int tickets)
    {
        if (tickets < 1) throw new ArgumentOutOfRangeException(nameof(tickets), "at least one ticket");
        Directory.CreateDirectory(directory);
        var sailings = Math.Max(12, tickets / 10);
        var routes = Path.Combine(directory, "routes.arrow");
        var sailingsPath = Path.Combine(directory, "sailings.parquet");
        var ticketsPath = Path.Combine(directory, "tickets.csv");
        WriteRoutes(routes);
        WriteSailings(sailingsPath, sailings);
        WriteTickets(ticketsPath, tickets, sailings);
        return [ticketsPath, sailingsPath, routes];
    }

    public void WriteRoutes(string path)
    {
        var n = Routes.Length;
        var ids = new long[n];
        var km = new double[n];
        var names = new Utf8ColumnBuilder(n, 256);
        var from = new Utf8ColumnBuilder(n, 256);
        var to = new Utf8ColumnBuilder(n, 256);
        for (var i = 0; i < n; i++)
        {
            ids[i] = i + 1;
            km[i] = Routes[i].Km;
            names.Append(Routes[i].Name);
            from.Append(Routes[i].From);
            to.Append(Routes[i].To);
        }
        var table = new Table(
            ["route_id", "name", "from_pier", "to_pier", "km"],
            [new Int64Column(ids, MissingMarker.Null), names.Build(MissingMarker.Null), from.Build(MissingMarker.Null), to.Build(MissingMarker.Null), new Float64Column(km, MissingMarker.Null)],
            n);
        ArrowIpcWriter.Write(table, path);
    }

    public void WriteSailings(string path, int count)
    {
        var rng = new Random(_seed + 1);
        var ids = new long[count];
        var routeIds = new long[count];
        var departs = new DateTime?[count];
        var vessels = new string?[count];
        var capacity = new int[count];
        var cancelled = new bool?[count];
        var start = new DateTime(2026, 5, 1, 6, 0, 0, DateTimeKind.Utc);
        for (var i = 0; i < count; i++)
        {
            ids[i] = 1000 + i;
            routeIds[i] = 1 + rng.Next(Routes.Length);
            departs[i] = rng.Next(40) == 0 || i % 17 == 3 ? null : start.AddMinutes(45L * i + 15 * rng.Next(3));
            vessels[i] = rng.Next(15) == 0 ? null : Vessels[rng.Next(Vessels.Length)];
            capacity[i] = 40 + 20 * rng.Next(6);
            cancelled[i] = rng.Next(25) == 0 || i % 19 == 5 ? null : rng.Next(12) == 0;
        }
        var fId = new DataField<long>("sailing_id");
        var fRoute = new DataField<long>("route_id");
        var fDeparts = new DateTimeDataField("departs_at", DateTimeFormat.Timestamp, isAdjustedToUTC: true, unit: DateTimeTimeUnit.Micros, isNullable: true);
        var fVessel = new DataField<string>("vessel", true);
        var fCapacity = new DataField<int>("capacity");
        var fCancelled = new DataField<bool?>("cancelled");
        var schema = new ParquetSchema(fId, fRoute, fDeparts, fVessel, fCapacity, fCancelled);
        AtomicFile.Write(path, stream =>
        {
            WriteParquetAsync(stream).AsTask().GetAwaiter().GetResult();
        });

        async ValueTask WriteParquetAsync(Stream stream)
        {
            await using var writer = await ParquetWriter.CreateAsync(schema, stream).ConfigureAwait(false);
            using var rg = writer.CreateRowGroup();
            await rg.WriteAsync<long>(fId, ids.AsMemory()).ConfigureAwait(false);
            await rg.WriteAsync<long>(fRoute, routeIds.AsMemory()).ConfigureAwait(false);
            await rg.WriteAsync<DateTime>(fDeparts, departs.AsMemory()).ConfigureAwait(false);
            await rg.WriteAsync(fVessel, vessels!).ConfigureAwait(false);
            await rg.WriteAsync<int>(fCapacity, capacity.AsMemory()).ConfigureAwait(false);
            await rg.WriteAsync<bool>(fCancelled, cancelled.AsMemory()).ConfigureAwait(false);
        }
    }

    public void WriteTickets(string path, int count, int sailings)
    {
        var rng = new Random(_seed);
        var season = new DateTime(2026, 4, 1, 0, 0, 0, DateTimeKind.Unspecified);
        AtomicFile.Write(path, stream =>
        {
            using var w = new StreamWriter(stream, new UTF8Encoding(false), 1 << 16, leaveOpen: true) { NewLine = "\n" };
            w.Write("ticket_id,sailing_id,passenger,age,fare,paid_at,note,is_child\n");
            var line = new StringBuilder(256);
            for (var i = 0; i < count; i++)
            {
                line.Clear();
                var ageMissing = rng.Next(12) == 0;
                var age = rng.Next(100) < 15 ? rng.Next(1, 12) : rng.Next(12, 88);
                var fare = Math.Round(2.5 + rng.Next(0, 3500) / 100.0, 2);
                if (age < 12) fare = Math.Round(fare / 2, 2);
                if (rng.Next(20) == 0) fare = -fare; // a refund
                var local = season.AddMinutes(rng.Next(0, 200 * 24 * 60)).AddSeconds(rng.Next(60));
                // Summer time on the lake is +02:00, winter +01:00; card terminals sometimes log UTC.
                var offset = rng.Next(10) == 0 ? "Z" : local.Month is >= 4 and <= 10 ? "+02:00" : "+01:00";
                line.Append((i + 1).ToString(CultureInfo.InvariantCulture)).Append(',');
                line.Append((1000 + rng.Next(sailings)).ToString(CultureInfo.InvariantCulture)).Append(',');
                line.Append(Quote(FirstNames[rng.Next(FirstNames.Length)] + " " + LastNames[rng.Next(LastNames.Length)])).Append(',');
                if (!ageMissing) line.Append(age.ToString(CultureInfo.InvariantCulture));
                line.Append(',');
                line.Append(fare.ToString("0.00", CultureInfo.InvariantCulture)).Append(',');
                line.Append(local.ToString("yyyy-MM-dd'T'HH:mm:ss", CultureInfo.InvariantCulture)).Append(offset).Append(',');
                if (rng.Next(6) == 0) line.Append(Quote(Notes[rng.Next(Notes.Length)]));
                line.Append(',');
                if (!ageMissing) line.Append(age < 12 ? "true" : "false");
                line.Append('\n');
                w.Write(line);
            }
        });
    }

    /// <summary>RFC 4180 §2 rules 6-7: quote a field holding a comma, quote or line break; double its quotes.</summary>
    private static string Quote(string field) =>
        field.AsSpan().IndexOfAny(",\"\r\n") < 0 ? field : "\"" + field.Replace("\"", "\"\"", StringComparison.Ordinal) + "\"";
}
