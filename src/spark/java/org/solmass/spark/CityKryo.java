package org.solmass.spark;

import com.esotericsoftware.kryo.Kryo;
import com.esotericsoftware.kryo.KryoSerializable;
import com.esotericsoftware.kryo.serializers.DefaultSerializers;
import com.esotericsoftware.kryo.serializers.JavaSerializer;
import org.apache.spark.serializer.KryoRegistrator;
import org.solmass.irradiation.FirstPasses;

import java.io.Serializable;

/**
 * The Kryo registrations of a city run ({@code spark.kryo.registrator}; {@link CitySpark} sets Kryo
 * as the serializer unless the configuration names one). The exchange's records
 * ({@link TileExchange}), a tile's reflection state and first pass, and the primitive arrays they
 * hold are plain classes of arrays: Kryo writes them field by field. Every other {@link Serializable}
 * class Kryo meets unregistered (records such as {@code tiles.CityPlan}, the JDK's immutable lists,
 * Scala objects) goes through Java serialization inside Kryo, as it did with Spark's Java serializer:
 * Kryo 4's field serializer cannot set a record's fields nor fill {@code List.of}'s lists. So a new
 * {@code Serializable} class needs no registration (registration is not required); register it
 * here only if it is a plain (non-record) class of arrays and primitives shipped in bulk.
 */
public final class CityKryo implements KryoRegistrator {
    @Override
    public void registerClasses(Kryo kryo) {
        // before the Serializable default below, so they keep Kryo's array serializers
        for (Class<?> c : new Class<?>[] {int[].class, long[].class, float[].class, double[].class, boolean[].class, byte[].class,
                int[][].class, float[][].class, double[][].class}) kryo.register(c);
        for (Class<?> c : new Class<?>[] {TileExchange.Packet.class, TileExchange.Request.class, TileExchange.Sends.class,
                TileExchange.Route.class, CityStages.TileState.class, FirstPasses.class}) kryo.register(c);
        kryo.addDefaultSerializer(KryoSerializable.class, DefaultSerializers.KryoSerializableSerializer.class);
        kryo.addDefaultSerializer(Serializable.class, JavaSerializer.class);
    }
}
